import type { FiguresResponse } from '@splitcase/contracts';
import { EstimatesNote, HotSurfaceNote } from '@/components/safety';
import { figureInputValue, figureValue, groupFigures } from '@/lib/figure-values';
import { NoneRecorded, ReportSubheading, ReportTable } from './report-layout';

/** Every derived figure with its value, formula, inputs and source, grouped as on the figures panel. */
export function ReportFigures({ data }: { data: FiguresResponse }) {
  if (!data.figures.length) return <NoneRecorded>No figures yet: they follow from the pack, loads and converters once recorded.</NoneRecorded>;
  return (
    <div>
      <EstimatesNote text={data.note} />
      {groupFigures(data.figures).map((g) => {
        // A caution once per group, beside the figures it concerns (unless a warning already says it).
        const said = g.figures.flatMap((f) => f.warnings).join(' ');
        const cautions = [...new Set(g.figures.map((f) => f.caution).filter((c): c is string => Boolean(c) && !said.includes(c!)))];
        return (
          <div key={g.title}>
            <ReportSubheading>{g.title}</ReportSubheading>
            <ReportTable label={`${g.title} figures`} head={['Figure', 'Value', 'Formula and inputs', 'Source']}>
              {g.figures.map((f) => (
                <tr key={f.key} data-figure={f.key}>
                  <td className="w-[24%] text-graphite-950">{f.label}</td>
                  <td className="num w-[13%] whitespace-nowrap font-semibold text-graphite-950">
                    {figureValue(f.value, f.unit)}
                  </td>
                  <td className="w-[38%]">
                    <p className="font-mono text-2xs text-graphite-900">{f.formula}</p>
                    {f.inputs.length > 0 && (
                      <p className="mt-0.5 text-2xs text-graphite-600">
                        {f.inputs.map((i, n) => (
                          <span key={`${i.label}-${n}`}>
                            {n > 0 && '; '}
                            {i.label} <span className="num text-graphite-900">{figureInputValue(i)}</span>
                          </span>
                        ))}
                      </p>
                    )}
                    {f.assumptions.length > 0 && <p className="mt-0.5 text-2xs text-graphite-500">Assumes: {f.assumptions.join(' ')}</p>}
                    {f.warnings.length > 0 && <p className="mt-0.5 text-2xs text-amber-800">Warning: {f.warnings.join(' ')}</p>}
                  </td>
                  <td className="w-[25%] text-2xs text-graphite-600" data-testid="figure-source">
                    {f.source}
                  </td>
                </tr>
              ))}
            </ReportTable>
            {cautions.map((c) => (
              <div key={c} className="mt-1.5 break-inside-avoid">
                <HotSurfaceNote text={c} />
              </div>
            ))}
          </div>
        );
      })}
    </div>
  );
}
