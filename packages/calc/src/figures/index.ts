export { type FormulaEntry, type FormulaKey, FORMULAS, formulaOf } from './formulas';
export {
  type LoadKind,
  type ConverterTopology,
  type ConverterRole,
  type SuggestionKind,
  type SuggestionSeverity,
  type TeardownPack,
  type TeardownLoad,
  type TeardownConverter,
  type TeardownTrace,
  type TeardownFigureInput,
  type Figure,
  type Suggestion,
  type TeardownFiguresResult,
  FIGURE_DEFAULTS,
  HOT_SURFACE_CAUTION,
  teardownFigures,
} from './teardown-figures';
