import { CHEMISTRY, CONNECTION, CONVERTER_ROLE, CONVERTER_TOPOLOGY, JOINING, LOAD_KIND, SURFACE_MATERIAL, type PowerSystemDto } from '@splitcase/contracts';
import { formatPercent, formatStored } from '@/lib/format';
import { Facts, NoneRecorded, ReportSubheading, ReportTable } from './report-layout';

/** A duty in a mode as a percentage ("50 %", "33.3 %"). */
const dutyText = (duty: number) => formatPercent(duty, Number.isInteger(Math.round(duty * 1000) / 10) ? 0 : 1);

/**
 * The pack, the loads, the operating modes and the converters as recorded, each value normalised from
 * its stored SI value with a sensible prefix ("2.70 Ah", "46.0 g", "60 %"), not the text typed ("2700mah", "46").
 */
export function ReportPower({ power }: { power: PowerSystemDto }) {
  const { pack, loads, converters, modes } = power;
  if (!pack && !loads.length && !converters.length && !modes.length) return <NoneRecorded>No power system recorded.</NoneRecorded>;
  const loadName = new Map(loads.map((l) => [l.id, l.label]));
  const converterName = new Map(converters.map((c) => [c.id, c.label || CONVERTER_TOPOLOGY.labels[c.topology]]));
  return (
    <div>
      <ReportSubheading>Pack</ReportSubheading>
      {pack ? (
        <Facts
          items={[
            { label: 'Chemistry', value: CHEMISTRY.labels[pack.chemistry] },
            { label: 'Cell format', value: pack.cellFormat ?? '—' },
            { label: 'Configuration', value: <span className="num">{`${pack.series}S${pack.parallel}P (${pack.series * pack.parallel} cell${pack.series * pack.parallel === 1 ? '' : 's'})`}</span> },
            { label: 'Protection', value: pack.protection ? 'Protection circuit present' : 'No protection circuit' },
            { label: 'Cell nominal', value: <span className="num">{formatStored(pack.nominalVolts, 'V')}</span> },
            { label: 'Cell maximum', value: <span className="num">{formatStored(pack.maxVolts, 'V')}</span> },
            { label: 'Cell rated', value: <span className="num">{formatStored(pack.capacityAh, 'Ah')}</span> },
            { label: 'Cell measured', value: <span className="num">{formatStored(pack.measuredCapacityAh, 'Ah')}</span> },
            { label: 'Pack mass', value: <span className="num">{formatStored(pack.massKg, 'kg')}</span> },
            { label: 'Joining', value: pack.joining ? JOINING.labels[pack.joining] : '—' },
          ]}
        />
      ) : (
        <NoneRecorded>No pack recorded.</NoneRecorded>
      )}

      <ReportSubheading>Loads</ReportSubheading>
      {loads.length ? (
        <ReportTable label="Loads" keep head={['Load', 'Kind', 'Per element', 'Count', 'Duty', 'Supply', 'Fed from', 'Heated area']}>
          {loads.map((l) => (
            <tr key={l.id}>
              <td className="text-graphite-950">{l.label}</td>
              <td>{LOAD_KIND.labels[l.kind]}</td>
              <td className="num">
                {[
                  l.resistanceOhms !== null ? formatStored(l.resistanceOhms, 'Ω') : null,
                  l.currentAmps !== null ? formatStored(l.currentAmps, 'A') : null,
                  l.powerWatts !== null ? formatStored(l.powerWatts, 'W') : null,
                ]
                  .filter(Boolean)
                  .join(', ') || '—'}
              </td>
              <td className="num whitespace-nowrap">
                {l.count}
                {l.count > 1 ? ` in ${CONNECTION.labels[l.connection].toLowerCase()}` : ''}
              </td>
              <td className="num">{formatPercent(l.duty, 0)}</td>
              <td className="num">{l.supplyVolts !== null ? formatStored(l.supplyVolts, 'V') : 'from its source'}</td>
              <td>{l.converterId ? (converterName.get(l.converterId) ?? 'a converter') : 'the pack'}</td>
              <td className="num">
                {l.heatedAreaM2 !== null ? formatStored(l.heatedAreaM2, 'm²') : '—'}
                {l.surfaceMaterial ? `, ${SURFACE_MATERIAL.labels[l.surfaceMaterial].toLowerCase()}` : ''}
              </td>
            </tr>
          ))}
        </ReportTable>
      ) : (
        <NoneRecorded>No loads recorded.</NoneRecorded>
      )}

      <ReportSubheading>Operating modes</ReportSubheading>
      {modes.length ? (
        <ReportTable label="Operating modes" keep head={['Mode', 'Note', 'Loads at their duty in the mode', 'Quiescent current']}>
          {modes.map((m) => (
            <tr key={m.id} data-mode={m.id}>
              <td className="font-medium text-graphite-950">{m.name}</td>
              <td>{m.note ?? '—'}</td>
              <td>
                {m.loads.length
                  ? m.loads.map((l) => (
                      <span key={l.loadId} className="block">
                        {loadName.get(l.loadId) ?? `Load #${l.loadId}`} <span className="num text-graphite-700">at {dutyText(l.duty)}</span>
                      </span>
                    ))
                  : 'No loads'}
              </td>
              <td className="num">{m.quiescentAmps !== null ? formatStored(m.quiescentAmps, 'A') : '—'}</td>
            </tr>
          ))}
        </ReportTable>
      ) : (
        <NoneRecorded>No operating modes recorded: the figures take all loads at once, each at its own duty.</NoneRecorded>
      )}

      <ReportSubheading>Converters</ReportSubheading>
      {converters.length ? (
        <ReportTable label="Converters" keep head={['Converter', 'Topology', 'Role', 'In → out', 'Rated current', 'Charge current', 'Efficiency']}>
          {converters.map((c) => (
            <tr key={c.id}>
              <td className="text-graphite-950">{c.label || '—'}</td>
              <td>{CONVERTER_TOPOLOGY.labels[c.topology]}</td>
              <td>{CONVERTER_ROLE.labels[c.role]}</td>
              <td className="num whitespace-nowrap">
                {formatStored(c.inputVolts, 'V')} → {formatStored(c.outputVolts, 'V')}
              </td>
              <td className="num">{c.ratedCurrentAmps !== null ? formatStored(c.ratedCurrentAmps, 'A') : '—'}</td>
              <td className="num">{c.chargeCurrentAmps !== null ? formatStored(c.chargeCurrentAmps, 'A') : '—'}</td>
              <td className="num whitespace-nowrap">
                {c.efficiency !== null ? formatPercent(c.efficiency, 0) : '—'} ({c.efficiencySource})
              </td>
            </tr>
          ))}
        </ReportTable>
      ) : (
        <NoneRecorded>No converters recorded.</NoneRecorded>
      )}
    </div>
  );
}
