// The farmer's sheet as display strings: one pure function feeds both the page and the PDF, so
// they always say the same thing. Every number comes from the stored screening (the engine).
import type { FigureKey, Said, Screening } from '@/lib/engine/screening-types';
import { sourceUrl } from '@/lib/engine/sources';
import { VERDICT_WORDS, type UnitSystem, type Verdict } from '../domain';
import { formatDay } from '../display/dates';
import { profileGeometry, type ProfileGeometry } from './profile';
import { formatFigure, formatWhole } from '../display/numbers';
import { renderMessage } from '../display/message';
import { sentence } from './sentence';
import { dailyInWords, pressureHead, quantity, type QuantityKind } from '../display/quantities';
import { plainTrade } from './trade-words';
import { siteMapGeometry, type SiteMapGeometry } from './site-map';
import type { PipePrice } from '../costs/bill-prices';
import { sheetCosts, type SheetCosts } from '../costs/cost-view';
import { priceListOf, type PriceList } from '../costs/price-list';

/** What the server hands over for one sheet: the stored screening and who/where/when. */
export interface SheetSource {
  visitId: string;
  farm: { name: string; area: string; ownerName: string | null };
  advisorName: string | null;
  visitedAt: string | null;
  screenedAt: string;
  screening: Screening;
  points: { role: string; label: string; lat: number | null; lon: number | null }[];
  pipeLengthsM: { drive: number | null; delivery: number | null };
  demandKinds: string[];
  /** The organisation's price list and pipe prices; the invented defaults when absent. */
  prices?: { list: Partial<PriceList>; pipes: PipePrice[] };
}

export interface SheetFigure {
  key: string;
  label: string;
  value: string;
  note: string;
}
export interface SheetCaution {
  code: string;
  title: string;
  text: string;
}
export interface SheetBomLine {
  item: string;
  size: string;
  quantity: string;
  note: string;
  basis: string;
  price: string;
}

/** One source under "Where the numbers come from": its name in words and, where it has one, the document's address. */
export interface SheetSourceLine {
  id: string;
  citation: string;
  url: string | null;
}

export interface SheetView {
  visitId: string;
  units: UnitSystem;
  farmName: string;
  area: string;
  ownerName: string | null;
  verdict: Verdict;
  verdictWord: string;
  summary: [string, string];
  figures: SheetFigure[];
  reasons: string[];
  conditions: string[];
  billOfMaterials: SheetBomLine[];
  /** Fittings, labour, the bill's total, the ten-year comparison and its assumptions; null with an empty bill. */
  costs: Omit<SheetCosts, 'lines'> | null;
  cautions: SheetCaution[];
  surveyed: string;
  engineVersion: string;
  method: string[];
  sources: SheetSourceLine[];
  profile: ProfileGeometry | null;
  /** The same profile laid out for a phone's width (under 640 px). */
  profileNarrow: ProfileGeometry | null;
  map: SiteMapGeometry | null;
}

export { VERDICT_WORDS };

const CAUTION_TITLES: Record<string, string> = {
  NOT_A_DESIGN: 'A first check, not a design',
  SURGE_PRESSURE: 'Pressure surges and pipe rating',
  WORKING_IN_WATER: 'Floods, working in water, frost',
  PERMITS: 'Water rights and permits',
  UNTREATED_WATER: 'Drinking water',
  NOISE: 'Noise',
  TANK_SAFETY: 'A covered, secured tank',
  BACKFLOW: 'Backflow into house plumbing',
};

/** Who the water is for, in words: "your household and animals", "your garden". */
export function needPhrase(kinds: string[]): string {
  const parts: string[] = [];
  if (kinds.some((k) => k.startsWith('person'))) parts.push('household');
  if (kinds.some((k) => !k.startsWith('person') && k !== 'garden-m2')) parts.push('animals');
  if (kinds.includes('garden-m2')) parts.push('garden');
  if (parts.length === 0) return 'your needs come to';
  const joined = parts.length === 1 ? parts[0] : `${parts.slice(0, -1).join(', ')} and ${parts[parts.length - 1]}`;
  return `your ${joined} need`;
}

/** The two-sentence summary at the top of the sheet. */
export function summarySentences(s: SheetSource, units: UnitSystem): [string, string] {
  const f = s.screening.figures;
  const delivery = f.deliveryLpd?.value ?? 0;
  const demand = f.demandLpd?.value ?? 0;
  const tank = s.points.find((p) => p.role === 'tank')?.label.trim();
  const where = tank ? `the tank (${tank.charAt(0).toLowerCase()}${tank.slice(1)})` : 'the tank';
  const first = `This site can deliver ${dailyInWords(delivery, units)} a day to ${where}; ${needPhrase(s.demandKinds)} ${dailyInWords(demand, units)}.`;
  const verdict = s.screening.verdict;
  const rams = f.ramCount?.value ?? 1;
  if (verdict === 'gravity') {
    const pipe = `This site can deliver ${dailyInWords(delivery, units)} a day to ${where} through a pipe; ${needPhrase(s.demandKinds)} ${dailyInWords(demand, units)}.`;
    return [
      pipe,
      'The tank sits below the intake, so the water runs down to it by itself: no pump is needed. Read the cautions before anything is bought or built.',
    ];
  }
  const second =
    verdict === 'go' && rams > 1
      ? `${rams} ram pumps side by side should do the job here; read the cautions before anything is bought or built.`
      : verdict === 'go'
        ? 'A ram pump should do the job here; read the cautions before anything is bought or built.'
        : verdict === 'conditional'
          ? 'A ram pump can do the job here if the conditions on this sheet are met first.'
          : 'As measured, a ram pump will not do the job here; the reasons are on this sheet.';
  return [first, second];
}

/**
 * A probability as a likelihood, never a promise: a word, then how often it held in the simulated
 * runs ("Very likely (about 99 in 100)"); never "100 in 100" or "0 in 100".
 */
export function chance(p: number): string {
  const inHundred = Math.min(Math.max(Math.round(p * 100), 1), 99);
  const word = p >= 0.95 ? 'Very likely' : p >= 0.75 ? 'Likely' : p >= 0.5 ? 'Uncertain' : p >= 0.2 ? 'Unlikely' : 'Very unlikely';
  return `${word} (about ${inHundred} in 100)`;
}

function keyFigures(s: SheetSource, units: UnitSystem): SheetFigure[] {
  const f = s.screening.figures;
  const out: SheetFigure[] = [];
  const q = (kind: QuantityKind) => (v: number) => quantity(v, kind, units).text;
  const add = (key: FigureKey, label: string, show: (v: number) => string, note = '') => {
    const v = f[key]?.value;
    if (key === 'ramCount' && v === 1) return;
    if (v !== null && v !== undefined) out.push({ key, label, value: show(v), note });
  };
  const gravity = s.screening.verdict === 'gravity';
  add('fallM', gravity ? 'Fall (intake to the low point)' : 'Fall (intake to ram)', q('length'), gravity ? 'Where the pipe runs lowest' : 'Drives the ram');
  add('designFlowLpm', 'Design flow', q('flowLpm'), 'Part of the driest flow measured');
  add('totalLiftM', 'Lift (ram to tank)', q('length'), 'Height plus pipe friction');
  add('liftRatio', 'Lift ratio', (v) => `${formatFigure(v)} to 1`, 'Lift ÷ fall');
  add('deliveryLpd', 'Delivery per day', q('litresPerDay'), gravity ? 'What the pipe carries, up to what the stream spares' : 'Ram running day and night');
  add('demandLpd', 'Demand per day', q('litresPerDay'), 'What you told us you need');
  add('demandMarginLpd', 'Margin', (v) => (v >= 0 ? `${q('litresPerDay')(v)} to spare` : `${q('litresPerDay')(-v)} short`), 'Delivery minus demand');
  add(
    'probabilityMeetsDemand',
    'Chance of meeting demand',
    chance,
    'Share of simulated runs that met demand, with the readings and the ram\u2019s efficiency varied as they vary in practice; a season drier than the one measured is not covered',
  );
  add('tankL', 'Tank', q('volume'), 'Storage to size for');
  add('ramCount', 'Rams', (v) => `${v} side by side`, 'Each on its own drive pipe');
  add('gravityHeadM', 'Intake above the tank', q('length'), 'The water runs down by itself');
  add('gravityPipeLengthM', 'Pipe from intake to tank', q('length'));
  add('workingPeakHeadM', 'Pressure at the ram in normal running', (v) => pressureHead(v, units), 'About the lift');
  add('blockedDeliveryHeadM', 'Pressure at the ram if the delivery is blocked', (v) => pressureHead(v, units), 'Fall plus surge: rate pipe and ram for it');
  add('peakPressureHeadM', 'Pressure at the ram', (v) => pressureHead(v, units), 'Lift plus surge: rate pipe and ram for it');
  add('drivePipeRatingM', 'Drive pipe rated for', (v) => pressureHead(v, units));
  return out;
}

/** The bill priced from the organisation's list, in its currency (US readers get US number formatting). */
function costsOf(s: SheetSource, units: UnitSystem): SheetCosts | null {
  const sc = s.screening;
  // A screening made before lines were priced has nothing to price: no costs rather than a total of nothing.
  if (!sc.billOfMaterials.some((line) => line.priceKey)) return null;
  const f = sc.figures;
  const water = { dailyL: f.demandLpd?.value ?? null, liftM: f.totalLiftM?.value ?? null, pumped: sc.verdict === 'go' || sc.verdict === 'conditional' };
  return sheetCosts(sc.billOfMaterials, priceListOf(s.prices?.list), s.prices?.pipes ?? [], water, units === 'us' ? 'en-US' : 'en-GB');
}

function billOfMaterials(s: SheetSource, units: UnitSystem, costs: SheetCosts | null): SheetBomLine[] {
  return s.screening.billOfMaterials.map((line, i) => {
    const amount = line.unit === 'm' ? quantity(line.quantity, 'pipeLength', units).text : `${formatWhole(line.quantity)} ${line.unit}`;
    const size = line.sizeMessage ? renderMessage(line.sizeMessage, units) : line.size;
    const note = line.noteMessage ? renderMessage(line.noteMessage, units) : line.note;
    const priced = costs?.lines[i];
    return {
      item: plainTrade(line.item, units),
      size: plainTrade(size, units),
      quantity: amount,
      note: plainTrade(note, units),
      basis: plainTrade(priced?.basis ?? '', units),
      price: priced?.price ?? '—',
    };
  });
}

function methodNotes(s: SheetSource): string[] {
  const f = s.screening.figures;
  const rule = (key: FigureKey) => f[key]?.rule;
  const mc = s.screening.monteCarlo;
  return [
    rule('fallM') && `Fall — ${rule('fallM')}.`,
    rule('designFlowLpm') && `Design flow — ${rule('designFlowLpm')}, the driest flow measured.`,
    rule('staticLiftM') && `Lift — ${rule('staticLiftM')}; then ${rule('totalLiftM')?.toLowerCase()}.`,
    rule('deliveryLpm') && `Delivery — ${rule('deliveryLpm')}, the ram's efficiency from a published curve (${rule('efficiency')}).`,
    rule('demandLpd') && `Demand — ${rule('demandLpd')}, from published daily figures.`,
    `Chance of meeting demand — the readings were varied within their measuring error ${formatWhole(mc.samples)} times; the share of those runs that met demand is shown.`,
  ].filter((line): line is string => typeof line === 'string' && line.length > 0);
}

/** Builds the sheet's display strings and drawings for a reader with the given unit preference. */
export function buildSheetView(s: SheetSource, units: UnitSystem): SheetView {
  const sc = s.screening;
  const fig = (key: FigureKey) => sc.figures[key]?.value ?? null;
  const fall = fig('fallM');
  const lift = fig('staticLiftM');
  const driveM = s.pipeLengthsM.drive ?? fig('driveLengthM');
  const deliveryM = s.pipeLengthsM.delivery;
  const profileInput =
    fall !== null && lift !== null && driveM && deliveryM
      ? { fallM: fall, staticLiftM: lift, driveLengthM: driveM, deliveryLengthM: deliveryM, gravity: sc.verdict === 'gravity' }
      : null;
  const profile = profileInput && profileGeometry(profileInput, units);
  const profileNarrow = profileInput && profileGeometry(profileInput, units, 360, 300);
  const located = s.points.filter((p): p is typeof p & { lat: number; lon: number } => p.lat !== null && p.lon !== null);
  const visited = s.visitedAt ? formatDay(s.visitedAt) : 'a date not recorded';
  const say = (said: Said) => sentence(said, units);
  const costs = costsOf(s, units);
  return {
    visitId: s.visitId,
    units,
    farmName: s.farm.name,
    area: s.farm.area,
    ownerName: s.farm.ownerName,
    verdict: sc.verdict,
    verdictWord: VERDICT_WORDS[sc.verdict],
    summary: summarySentences(s, units),
    figures: keyFigures(s, units),
    reasons: sc.reasons.map(say),
    conditions: sc.conditions.map(say),
    billOfMaterials: billOfMaterials(s, units, costs),
    costs: costs && {
      currency: costs.currency,
      extras: costs.extras.map((e) => ({ ...e, basis: plainTrade(e.basis, units) })),
      total: costs.total,
      comparison: costs.comparison,
      assumptions: costs.assumptions.map((a) => plainTrade(a, units)),
    },
    cautions: sc.cautions.map((c) => ({ code: c.code, title: CAUTION_TITLES[c.code] ?? 'Caution', text: say(c) })),
    surveyed: `Surveyed by ${s.advisorName ?? 'an advisor'} on ${visited}; screened on ${formatDay(s.screenedAt)}.`,
    engineVersion: sc.engineVersion,
    method: methodNotes(s),
    // Sources by their names in words, each once, in the order the rules cite them; the address comes from today's
    // registry, so a sheet screened before a source had one links to it too.
    sources: [...new Map(sc.sources.map((src) => [src.citation, { id: src.id, citation: src.citation, url: sourceUrl(src.id) }])).values()],
    profile,
    profileNarrow,
    map: siteMapGeometry(
      located.map((p) => ({ role: p.role, label: p.label, lat: p.lat, lon: p.lon })),
      units,
    ),
  };
}
