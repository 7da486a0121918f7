export {
  buckDutyCycle,
  boostDutyCycle,
  buckDutyCycleWithLosses,
  boostDutyCycleWithLosses,
  conversionLossWatts,
  converterInputWatts,
} from './duty-cycle';
export { powerBankOutputAh } from './power-bank';
