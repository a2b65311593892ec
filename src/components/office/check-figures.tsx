// What each readiness check computed, laid out the way the trade reads it: the demand working,
// the voltage-drop table by cable size, the network-operator route, the cable reach per way of
// parking; anything else as labelled figures.
import { cableSourceWords, loadsDeclaredWords, networkRouteWord, portWord, staffAnswer, wayWord } from '@/lib/vocabulary';
import { countOf } from '@/lib/grammar';
import type { ReactNode } from 'react';
import type { CheckResult } from '@/lib/readiness/types';
import { uploadKindInfo, type UploadKind } from '@/lib/schemas/uploads';
import { CheckIcon, StopIcon } from '@/components/icons';
import { formatDay, formatNumber } from './format';

type Figures = Record<string, unknown>;

const num = (v: unknown): number | null => (typeof v === 'number' && Number.isFinite(v) ? v : null);
const amps = (v: unknown) => (num(v) === null ? '—' : `${formatNumber(num(v)!)} A`);
const metres = (v: unknown) => (num(v) === null ? '—' : `${formatNumber(num(v)!)} m`);

export function FigureList({ rows }: { rows: [string, ReactNode][] }) {
  return (
    <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-0.5 text-sm sm:grid-cols-[auto_1fr_auto_1fr]">
      {rows.map(([k, v]) => (
        <div key={k} className="contents">
          <dt className="text-ground-700">{k}</dt>
          <dd className="font-semibold tabular-nums text-ink">{v}</dd>
        </div>
      ))}
    </dl>
  );
}

function MiniTable({ caption, head, rows, highlight }: { caption: string; head: string[]; rows: ReactNode[][]; highlight?: number }) {
  return (
    <div className="mt-2 overflow-x-auto">
      <table className="w-full min-w-[28rem] text-left text-sm tabular-nums">
        <caption className="mb-1 text-left text-xs font-semibold uppercase tracking-wide text-ground-600">{caption}</caption>
        <thead className="border-b border-ground-200 text-ground-700">
          <tr>{head.map((h) => <th key={h} scope="col" className="px-2 py-1 font-semibold">{h}</th>)}</tr>
        </thead>
        <tbody>
          {rows.map((r, i) => (
            <tr key={i} className={`border-b border-ground-50 ${highlight === i ? 'bg-clear-soft font-semibold' : ''}`}>
              {r.map((c, j) => <td key={j} className="px-2 py-1">{c}</td>)}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

function PassWord({ ok, yes = 'Passes', no = 'Fails' }: { ok: boolean; yes?: string; no?: string }) {
  return ok ? (
    <span className="inline-flex items-center gap-1 text-clear"><CheckIcon className="h-4 w-4" />{yes}</span>
  ) : (
    <span className="inline-flex items-center gap-1 text-blocked"><StopIcon className="h-4 w-4" />{no}</span>
  );
}

type DemandItem = { load: string; declared: string; allowanceAmps: number; rule: string; phase?: number };

function Assumptions({ list }: { list: unknown }) {
  const items = (Array.isArray(list) ? list : []).filter((x): x is string => typeof x === 'string');
  if (items.length === 0) return null;
  return (
    <div className="mt-2 text-sm" data-testid="figure-assumptions">
      <p className="font-semibold text-ground-800">Assumed</p>
      <ul className="list-disc pl-5 text-ground-800">{items.map((a) => <li key={a}>{a}</li>)}</ul>
    </div>
  );
}

function SupplyHeadroom({ f }: { f: Figures }) {
  const items = (Array.isArray(f.items) ? f.items : []) as DemandItem[];
  const byRating = f.headroomByRating && typeof f.headroomByRating === 'object' ? (f.headroomByRating as Record<string, number>) : null;
  const phases = Array.isArray(f.phaseDemandAmps) ? (f.phaseDemandAmps as number[]) : null;
  const measured = f.basis === 'measured';
  return (
    <>
      <FigureList
        rows={[
          ['Basis', measured ? 'Measured maximum demand (smart meter or logger)' : 'Estimated, IET OSG Table A2'],
          [measured ? 'Existing demand, measured' : 'Existing demand after diversity', amps(f.existingDemandAmps)],
          ['New charge point', `${num(f.chargerKw) === null ? '—' : `${formatNumber(num(f.chargerKw)!)} kW`}, ${amps(f.chargerAmps)}${f.chargerPhases === 3 ? ' per phase' : ''}${f.chargerChosen === false ? ' (assumed)' : ''}`],
          ['Supply', f.supplyPhases === 3 ? 'Three phase (per-phase figures)' : 'Single phase'],
          ['Assessed maximum demand', `${amps(f.assessedDemandAmps)}${f.supplyPhases === 3 ? ' (busiest phase)' : ''}`],
          ['At least', f.firm ? '—' : amps(f.lowerBoundDemandAmps)],
          ['Main fuse (cut-out)', f.fuseAmps === null ? 'Not known' : amps(f.fuseAmps)],
          ['Headroom', f.headroomAmps === null || f.headroomAmps === undefined ? '—' : amps(f.headroomAmps)],
          ['Comfortable margin', amps(f.marginAmps)],
          ['Loads declared', loadsDeclaredWords(Boolean(f.loadsDeclared))],
          ['Estimate firm', f.firm ? 'Yes' : 'No — amber at best'],
          ...(f.phaseFit && f.phaseFit !== 'fits' ? [['Phases for the charger', f.phaseFit === 'needs-three-phase' ? 'Needs three phase; supply is single' : 'Needs three phase; supply not known'] as [string, ReactNode]] : []),
        ]}
      />
      {phases && (
        <MiniTable caption="Demand per phase, with the charger" head={['Phase', 'Demand']} rows={phases.map((a, i) => [`L${i + 1}`, amps(a)])} />
      )}
      {byRating && (
        <MiniTable caption="Headroom at each cut-out rating" head={['Cut-out rating', 'Headroom']} rows={Object.entries(byRating).map(([r, h]) => [`${r} A`, <span className={h < 0 ? 'text-blocked' : ''}>{amps(h)}</span>])} />
      )}
      {items.length > 0 && (
        <MiniTable
          caption="Maximum demand working"
          head={phases ? ['Load', 'Declared', 'Allowance', 'Phase', 'Rule'] : ['Load', 'Declared', 'Allowance', 'Rule']}
          rows={items.map((i) => [
            i.load,
            i.declared,
            amps(i.allowanceAmps),
            ...(phases ? [i.phase ? `L${i.phase}` : i.load === 'New charge point' ? 'All / busiest' : '—'] : []),
            <span className="text-xs text-ground-700">{i.rule}</span>,
          ])}
        />
      )}
      <Assumptions list={f.assumptions} />
    </>
  );
}

type SizeRow = { csaMm2: number; mvPerAPerM: number; volts: number; percent: number; tabulatedAmps?: number; capacityAmps?: number; passes?: boolean; passesDrop?: boolean; passesCapacity?: boolean };
type Factor = { name: string; value: number; basis: string };

function CableRun({ f }: { f: Figures }) {
  const sizes = (Array.isArray(f.sizes) ? f.sizes : []) as SizeRow[];
  const factors = (Array.isArray(f.factors) ? f.factors : []) as Factor[];
  const ref70 = f.reference70C as { table?: string; sizes?: SizeRow[] } | undefined;
  const limit = num(f.limitPercent);
  const upstream = num(f.upstreamPercent) ?? 0;
  return (
    <>
      <FigureList
        rows={[
          ['Design current Ib', `${amps(f.currentAmps)}${f.phases === 3 ? ' per phase' : ''}${f.chargerChosen === false ? ' (rating assumed)' : ''}`],
          ['Protective device In', amps(f.deviceAmps)],
          ['Terminal basis', num(f.terminalTemperatureC) === null ? '—' : `${f.terminalTemperatureC} °C`],
          ['Reference method', typeof f.method === 'string' ? (f.method === 'D' ? 'D (in the ground)' : 'C (clipped direct)') : '—'],
          ['Correction factor', num(f.factor) === null ? '—' : formatNumber(num(f.factor)!, 2)],
          ['Run length', metres(f.lengthMetres)],
          ['Route', typeof f.route === 'string' ? staffAnswer('charger.route', f.route, true) : 'Not given'],
          ['Voltage-drop limit', limit === null ? '—' : `${formatNumber(limit)}% − ${formatNumber(upstream)}% upstream = ${formatNumber(num(f.limitVolts) ?? 0, 2)} V`],
          ['Smallest size that passes', num(f.recommendedCsaMm2) === null ? (sizes.length ? 'None of the sizes' : '—') : `${f.recommendedCsaMm2} mm²`],
          ['Long run over', metres(f.longRunThresholdMetres)],
        ]}
      />
      {typeof f.routeAssumption === 'string' && <p className="mt-2 text-sm text-ground-800">{f.routeAssumption}.</p>}
      {factors.length > 0 && (
        <MiniTable caption="Correction factors applied to the tabulated capacity" head={['Factor', 'Value', 'Basis']} rows={factors.map((x) => [x.name, formatNumber(x.value, 2), <span className="text-xs text-ground-700">{x.basis}</span>])} />
      )}
      {sizes.length > 0 && (
        <MiniTable
          caption={typeof f.table === 'string' ? f.table : 'Capacity and voltage drop by cable size'}
          head={['Size', 'It', 'Iz', 'mV/A/m', 'Drop', 'Drop %', 'Result']}
          highlight={sizes.findIndex((s) => s.csaMm2 === f.recommendedCsaMm2)}
          rows={sizes.map((s) => [
            `${s.csaMm2} mm²`,
            s.tabulatedAmps === undefined ? '—' : `${s.tabulatedAmps} A`,
            s.capacityAmps === undefined ? '—' : `${formatNumber(s.capacityAmps)} A`,
            formatNumber(s.mvPerAPerM, 2),
            `${formatNumber(s.volts, 2)} V`,
            `${formatNumber(s.percent, 2)}%`,
            <PassWord ok={Boolean(s.passes)} no={s.passesCapacity === false ? 'Iz below In' : 'Drop too high'} />,
          ])}
        />
      )}
      {ref70?.sizes && ref70.sizes.length > 0 && (
        <details className="mt-2 text-sm">
          <summary className="cursor-pointer text-ground-700">70 °C thermoplastic drop comparison (not used to recommend; confirm against the printed table)</summary>
          <MiniTable
            caption={ref70.table ?? 'Table 4D4B'}
            head={['Size', 'mV/A/m', 'Drop', 'Drop %']}
            rows={ref70.sizes.map((s) => [`${s.csaMm2} mm²`, formatNumber(s.mvPerAPerM), `${formatNumber(s.volts)} V`, `${formatNumber(s.percent)}%`])}
          />
        </details>
      )}
    </>
  );
}

type ElectrodeTest = { raOhms: number | null; idnMilliamps: number | null; touchVolts: number | null; passes: boolean | null; possiblyUnstable: boolean | null };
const earthingWords: Record<string, string> = { pme: 'PME (TN-C-S)', tns: 'TN-S', tt: 'TT', unknown: 'Not known' };
const groundWords: Record<string, string> = { near: 'Near: an electrode is practical', far: 'Far', 'distance-unknown': 'Distance not given', none: 'None', unknown: 'Not answered' };

function Earthing({ f }: { f: Figures }) {
  const test = f.electrodeTest as ElectrodeTest | null | undefined;
  return (
    <>
      <FigureList
        rows={[
          ['Earthing arrangement', earthingWords[String(f.earthing)] ?? String(f.earthing ?? '—')],
          ['722.411.4.1 measure needed', f.measureNeeded ? 'Yes' : 'No'],
          ['Measure recorded', typeof f.earthingMeasureLabel === 'string' ? f.earthingMeasureLabel : f.measureNeeded ? 'Not yet — amber until recorded' : '—'],
          ['Used outdoors', f.outdoorUse === 'possibly' ? 'Possibly (garage)' : 'Yes'],
          ['Soft ground', groundWords[String(f.electrodeGround)] ?? '—'],
          ['Soft ground distance', metres(f.softGroundMetres)],
        ]}
      />
      {test && (
        <MiniTable
          caption="Earth electrode: RA × IΔn ≤ 50 V (BS 7671 411.5.3)"
          head={['RA', 'IΔn', 'RA × IΔn', 'Result', 'Stability (above 200 Ω)']}
          rows={[[
            test.raOhms === null ? 'Not recorded' : `${formatNumber(test.raOhms)} Ω`,
            test.idnMilliamps === null ? 'Not recorded' : `${formatNumber(test.idnMilliamps)} mA`,
            test.touchVolts === null ? '—' : `${formatNumber(test.touchVolts, 2)} V`,
            test.passes === null ? 'Not tested' : <PassWord ok={test.passes} yes="≤ 50 V" no="Over 50 V" />,
            test.possiblyUnstable === null ? '—' : test.possiblyUnstable ? 'May not be stable (common practice)' : 'Fine',
          ]]}
        />
      )}
    </>
  );
}



function NetworkOperator({ f }: { f: Figures }) {
  const reasons = (Array.isArray(f.reasons) ? f.reasons : []) as { code: string; text: string; certain?: boolean }[];
  return (
    <>
      <FigureList
        rows={[
          ['Route', networkRouteWord(f.route)],
          ['Settled', f.settled ? 'Yes' : 'Not yet — answers missing'],
          ['Assessed maximum demand', `${amps(f.assessedDemandAmps)}${f.supplyPhases === 3 ? ' per phase' : ''}`],
          ['Connect & Notify limit', `${amps(f.demandLimitAmps)}${f.supplyPhases === 3 ? ' per phase' : ''}`],
          ['Main fuse (cut-out)', f.fuseAmps === null ? 'Not known' : amps(f.fuseAmps)],
          ['Lead time allowed', countOf(num(f.leadTimeDays) ?? 0, 'day')],
          ['Notify within', num(f.notifyWithinDays) === null ? '—' : `${countOf(num(f.notifyWithinDays)!, 'day')} of connection`],
          ['Distribution region', typeof f.region === 'string' ? f.region : 'Not known (no valid MPAN)'],
        ]}
      />
      {reasons.length > 0 && (
        <div className="mt-2 text-sm">
          <p className="font-semibold text-ground-800">Why it must apply first</p>
          <ul className="list-disc pl-5">{reasons.map((r) => <li key={r.code}>{r.text}{r.certain === false ? ' (possible — an answer is missing)' : ''}</li>)}</ul>
        </div>
      )}
    </>
  );
}

type Verdict = { bayIndex: number; way: string; planMetres: number; requiredMetres: number; reaches: boolean; shortByMetres: number };

function CableReach({ f }: { f: Figures }) {
  const verdicts = (Array.isArray(f.verdicts) ? f.verdicts : []) as Verdict[];
  const car = f.car as { lengthM?: number; widthM?: number } | undefined;
  return (
    <>
      <FigureList
        rows={[
          ['Cable', `${metres(f.cableMetres)} (${cableSourceWords[String(f.cableSource)] ?? '—'})`],
          ['Charge port', portWord(f.port)],
          ['Usually parked', typeof f.habit === 'string' ? staffAnswer('parking.habit', f.habit, true) : '—'],
          ['Car size', car?.lengthM ? `${formatNumber(car.lengthM)} × ${formatNumber(car.widthM ?? 0)} m` : '—'],
          ['Slack allowed', metres(f.slackMetres)],
          ...(f.otherBaysOccupied === true || f.otherBaysOccupied === false
            ? [['Other bay', f.otherBaysOccupied ? 'Occupied: the car there is an obstacle' : 'Empty (one car)'] as [string, ReactNode]]
            : []),
        ]}
      />
      {verdicts.length > 0 && (
        <MiniTable
          caption="Reach for each bay and way of parking"
          head={['Bay', 'Parked', 'Plan distance', 'Cable needed', 'Result']}
          rows={verdicts.map((v) => [
            `Bay ${v.bayIndex + 1}`,
            wayWord(v.way),
            metres(v.planMetres),
            metres(v.requiredMetres),
            <PassWord ok={v.reaches} yes="Reaches" no={`Short by ${formatNumber(v.shortByMetres)} m`} />,
          ])}
        />
      )}
    </>
  );
}

function kinds(v: unknown): string {
  if (!Array.isArray(v) || v.length === 0) return 'None';
  return v.map((k) => uploadKindInfo[k as UploadKind]?.title ?? String(k)).join(', ');
}

const docStateWords: Record<string, string> = { accepted: 'Accepted', waiting: 'Waiting for review', rejected: 'Rejected', missing: 'Not sent' };

function Documents({ f }: { f: Figures }) {
  const required = (Array.isArray(f.required) ? f.required : []) as { kind: UploadKind; state: string; reason: string | null }[];
  if (required.length === 0) return <FigureList rows={[['Missing', kinds(f.missingKinds)], ['Waiting for review', kinds(f.waitingKinds)], ['Rejected', kinds(f.rejectedKinds)]]} />;
  return (
    <MiniTable
      caption="Required uploads"
      head={['Upload', 'State', 'Reason given']}
      rows={required.map((r) => [
        uploadKindInfo[r.kind]?.title ?? r.kind,
        r.state === 'accepted' ? <PassWord ok yes="Accepted" /> : r.state === 'rejected' ? <PassWord ok={false} no="Rejected" /> : docStateWords[r.state] ?? r.state,
        r.reason ?? '—',
      ])}
    />
  );
}

// Labels for the figures the other checks report; anything unknown is spelt out from its key.
const knownLabels: Record<string, string> = {
  mpanCore: 'MPAN core',
  valid: 'Check digit valid',
  reason: 'Reason',
  distributorId: 'Distributor ID',
  distributorStatus: 'Distributor listed',
  knownLeadDays: 'Known lead',
  knownSpareDays: 'Spare without the possible network step',
  networkLeadKnown: 'Network step known',
  region: 'Distribution region',
  earthing: 'Earthing arrangement',
  outdoorUse: 'Used outdoors',
  measureNeeded: 'Open-PEN measure needed',
  softGround: 'Soft ground near',
  softGroundMetres: 'Soft ground distance',
  nearThresholdMetres: 'Counts as near within',
  electrodeGround: 'Electrode ground',
  ttMaxRaOhms: 'TT RA limit (30 mA RCD)',
  ttStableRaOhms: 'TT RA for stability',
  kind: 'Parking',
  evidence: 'Evidence',
  evidenceReason: 'Evidence reason',
  today: 'Today',
  deliveryDate: 'Car due',
  surveyLeadDays: 'Survey lead',
  installLeadDays: 'Install lead',
  supplyUpgradeLeadDays: 'Network operator lead',
  totalLeadDays: 'Total lead',
  networkRoute: 'Network route',
  earliestInstallDate: 'Earliest install',
  slackDays: 'Slack wanted',
  daysUntilDelivery: 'Days to delivery',
  spareDays: 'Spare days',
};

function keyWords(key: string): string {
  if (knownLabels[key]) return knownLabels[key]!;
  const words = key.replace(/([a-z0-9])([A-Z])/g, '$1 $2').toLowerCase();
  return words.charAt(0).toUpperCase() + words.slice(1);
}

function valueWords(key: string, v: unknown): string {
  if (v === null || v === undefined || v === '') return '—';
  if (typeof v === 'boolean') return v ? 'Yes' : 'No';
  if (typeof v === 'number') {
    if (/Ohms$/.test(key)) return `${formatNumber(v)} Ω`;
    if (/Days$/.test(key) || key === 'slackDays') return countOf(Math.round(v), 'day');
    if (/Metres$/.test(key)) return `${formatNumber(v)} m`;
    if (/Amps$/.test(key)) return `${formatNumber(v)} A`;
    return formatNumber(v);
  }
  if (typeof v === 'string') {
    if (/^\d{4}-\d{2}-\d{2}$/.test(v)) return formatDay(v);
    if (key === 'earthing') return staffAnswer('supply.earthing', v, true) ?? v;
    if (key === 'kind') return staffAnswer('parking.kind', v, true) ?? v;
    if (key === 'networkRoute') return networkRouteWord(v);
    // Codes such as "yes" or "unknown" read better as words with a capital.
    return /^[a-z][a-z-]*$/.test(v) ? `${v.charAt(0).toUpperCase()}${v.slice(1).replace(/-/g, ' ')}` : v;
  }
  if (Array.isArray(v)) return v.length ? v.map((x) => (typeof x === 'object' ? JSON.stringify(x) : String(x))).join(', ') : 'None';
  return JSON.stringify(v);
}

function Generic({ f }: { f: Figures }) {
  const rows = Object.entries(f).map(([k, v]) => [keyWords(k), valueWords(k, v)] as [string, ReactNode]);
  if (rows.length === 0) return null;
  return <FigureList rows={rows} />;
}

/** The figures of one check, with a layout for the ones the trade tabulates. */
export function CheckFigures({ check }: { check: CheckResult }) {
  const f = check.figures ?? {};
  switch (check.id) {
    case 'supply-headroom':
      return <SupplyHeadroom f={f} />;
    case 'cable-run':
      return <CableRun f={f} />;
    case 'network-operator':
      return <NetworkOperator f={f} />;
    case 'cable-reach':
      return <CableReach f={f} />;
    case 'earthing':
      return <Earthing f={f} />;
    case 'documents':
      return <Documents f={f} />;
    default:
      return <Generic f={f} />;
  }
}
