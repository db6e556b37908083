// Registry of the sources behind every rule and figure; figures refer to these by id.

export type Confidence = 'found' | 'from-memory' | 'computed' | 'common-practice';

export interface Source {
  readonly id: string;
  readonly citation: string;
  readonly confidence: Confidence;
  readonly note?: string;
  /** Where the document can be read (a DOI, the publisher's or agency's own page); only an address seen to exist, none where the source has no stable public one. */
  readonly url?: string;
}

const list = [
  {
    id: 'wftw-rws4d5',
    citation: 'USAID, Water for the World, Technical Note RWS.4.D.5 "Designing a Hydraulic Ram Pump"',
    confidence: 'found',
    note: 'D = S·F·E/L; E = 0.66 commercial, 0.33 home-built; supply ≥ 7 × pumped; fall ≥ 0.5 m',
  },
  {
    id: 'building-trades-pocketbook',
    citation: 'Building Trades Pocketbook, "The Hydraulic Ram" (International Textbook Co., c.1899–1905)',
    confidence: 'found',
    note: 'Efficiency vs lift/fall table r = 4…26; drive pipe 25–50 ft',
  },
  { id: 'eytelwein-1805', citation: 'Eytelwein (1805), empirical ram efficiency η = 1.12 − 0.2·√(h/H)', confidence: 'from-memory' },
  { id: 'ogden-1911', citation: 'Ogden (1911), Rural Hygiene, Table XI (ram sizes vs drive flow; about 30 ft lift per ft of fall)', confidence: 'found' },
  {
    id: 'daubuisson-efficiency',
    citation: 'D\'Aubuisson efficiency η = q·h/(Q·H); NITK Surathkal lab notes "Performance characteristics of hydraulic ram"',
    confidence: 'found',
    url: 'https://virtual-labs.github.io/exp-hydraulic-ram-nitk/simulation/index.html',
  },
  { id: 'rankine-efficiency', citation: 'Rankine efficiency η = q·(h − H)/((Q − q)·H); NITK Surathkal lab notes', confidence: 'found' },
  {
    id: 'wikipedia-hydraulic-ram',
    citation: 'Wikipedia, "Hydraulic ram" (efficiency 60 %, up to 80 %; drive pipe 3–7 × fall citing Perkin; delivery pipe about half the drive)',
    confidence: 'found',
    url: 'https://en.wikipedia.org/wiki/Hydraulic_ram',
  },
  {
    id: 'drive-length-other-rules',
    citation: 'Drive pipe length 5–10 × H (Watt 1975), 6–12 × H (Peace Corps hydram manual 1981), 2–4 × H (Jeffery et al. 1992)',
    confidence: 'from-memory',
  },
  { id: 'nitk-ram-notes', citation: 'NITK Surathkal, hydraulic ram lab theory notes (L/D 150–1000; rigid drive pipe)', confidence: 'found' },
  {
    id: 'clemson-smith',
    citation: 'Smith (Clemson Univ.), "Home-made hydraulic ram pump" (≈10 psi back-pressure to cycle; stand pipe for long drive)',
    confidence: 'found',
    url: 'https://lgpress.clemson.edu/publication/homemade-hydraulic-ram-pump-for-livestock-water/',
  },
  { id: 'thomas-1994', citation: 'Thomas (1994), DTU Warwick Working Paper 41 (Joukowsky flow must reach the delivery head)', confidence: 'found' },
  {
    id: 'usbr-wmm-ch7',
    citation: 'USBR Water Measurement Manual, 3rd ed. (1997, rev. 2001), ch. 7: Kindsvater–Shen V-notch (ISO 1438), Ce = 0.578, kh = 0.85 mm for 90°',
    confidence: 'found',
    note: 'eq. 7-3, 25–100°, head ≥ 0.2 ft confirmed on the USBR chapter page; Ce/kh via Ponce (SDSU) lab notes',
    url: 'https://www.usbr.gov/tsc/techreferences/mands/wmm/chap07_07.html',
  },
  { id: 'kindsvater-shen-angles', citation: 'Kindsvater–Shen Ce and kh for notch angles other than 90° (ISO 1438 figure)', confidence: 'from-memory' },
  {
    id: 'francis-weir',
    citation: 'Francis (1883) contracted rectangular weir Q = 3.33·(L − 0.2h)·h^1.5 (ft, cfs); SI coefficient 1.84',
    confidence: 'found',
    note: 'US form found; SI coefficient 1.84 from memory',
  },
  {
    id: 'float-method',
    citation: 'Herschy, Streamflow Measurement, "Measurement by floats" (v = L/t; k 0.8–0.9); USGS WSP 2175 (Rantz 1982) k = 0.85',
    confidence: 'found',
    note: '0.85 in USGS from memory',
    url: 'https://doi.org/10.3133/wsp2175',
  },
  {
    id: 'bucket-method',
    citation: 'Volumetric (bucket and stopwatch) Q = V/t, mean of repeat fills; Peace Corps hydram training manual (1981), Session 3',
    confidence: 'found',
  },
  {
    id: 'levelling-hi',
    citation: 'Height-of-instrument booking and arithmetic check ΣBS − ΣFS = last RL − first RL (surveying textbooks, e.g. Uren & Price)',
    confidence: 'found',
  },
  {
    id: 'orders-of-accuracy',
    citation: 'Levelling loop misclosure k·√K: 4.0 / 8.4 / 12.0 mm (1st/2nd/3rd order); ACSM definitions; US Army EN0593',
    confidence: 'found',
  },
  {
    id: 'clinometer-sine',
    citation: 'Δh = slope distance × sin(angle) (Michigan Tech Peace Corps mapping notes; FAO topography manual ch. 4)',
    confidence: 'found',
    url: 'https://www.fao.org/4/R7021E/r7021e00.htm',
  },
  {
    id: 'hose-level',
    citation: 'Water-tube level: both water surfaces at one elevation (construction practice guides; FAO topography manual)',
    confidence: 'found',
    note: '±5 mm per set-up is from memory',
  },
  {
    id: 'gps-sps-2008',
    citation: 'GPS SPS Performance Standard (2008): ≈3 m H / 5 m V (95 %); vertical ≈ 1.5–3 × horizontal',
    confidence: 'found',
    url: 'https://www.gps.gov/technical/ps/2008-SPS-performance-standard.pdf',
  },
  {
    id: 'standard-atmosphere',
    citation: 'Hypsometric equation, standard atmosphere (≈ 8.3 m per hPa near sea level)',
    confidence: 'computed',
    url: 'https://ntrs.nasa.gov/citations/19770009539',
  },
  {
    id: 'hazen-williams-epanet',
    citation: 'Rossman (2000), EPANET 2 Users Manual (US EPA), Table 3.1: h = 10.67·L·Q^1.852/(C^1.852·D^4.87)',
    confidence: 'found',
    note: 'US form 4.727·L·Q^1.852/(C^1.852·d^4.871) and SI 10.67 seen in open-source re-implementations; the manual itself not opened',
    url: 'https://nepis.epa.gov/Exe/ZyPURL.cgi?Dockey=P1007WWU.TXT',
  },
  {
    id: 'darcy-colebrook',
    citation: 'Darcy–Weisbach with Colebrook (1939) friction factor; Swamee & Jain (1976) start value',
    confidence: 'found',
    url: 'https://doi.org/10.1680/ijoti.1939.13150',
  },
  { id: 'water-properties', citation: 'Water viscosity (Vogel equation) and density vs temperature', confidence: 'from-memory' },
  {
    id: 'korteweg',
    citation: 'Korteweg wave speed a = √(K/ρ)/√(1 + c·K·D/(E·e)) (Wylie & Streeter 1993; Chaudhry 2014)',
    confidence: 'found',
    url: 'https://doi.org/10.1007/978-1-4614-8538-4',
  },
  { id: 'joukowsky', citation: 'Joukowsky (1900): ΔH = a·Δv/g (Wylie & Streeter 1993)', confidence: 'found' },
  { id: 'pipe-moduli', citation: 'Pipe elastic moduli: steel 207 GPa, PVC 2.9 GPa, HDPE 0.9 GPa short-term', confidence: 'from-memory' },
  {
    id: 'hazen-c-values',
    citation: 'Hazen–Williams C: plastic 150, galvanized steel 120 (online references; EPANET Table 3.2)',
    confidence: 'found',
    note: 'EPANET table values from memory',
  },
  { id: 'roughness-values', citation: 'Absolute roughness: PVC 0.0015 mm, PE 0.007 mm, galvanized steel 0.15 mm (Moody chart)', confidence: 'from-memory' },
  {
    id: 'pressure-rating-sdr',
    citation: 'Plastic pipe pressure rating P = 2·HDS/(SDR − 1) (ISO 161 / ASTM); HDS PVC 13.8 MPa, PE4710 6.9 MPa',
    confidence: 'from-memory',
    note: 'PVC SDR 21 = 200 psi and SDR 26 = 160 psi at 73 °F (ASTM D2241) confirmed in secondary summaries; the formula and PE values stay from memory',
  },
  {
    id: 'steel-pipe-sizes',
    citation: 'Steel pipe dimensions (ASME B36.10, Schedule 40); threaded malleable-iron fittings 300/600 psi (class 150/300)',
    confidence: 'from-memory',
    note: '2″ Sch 40 ID 52.5 mm, wall 3.91 mm confirmed in published tables',
    url: 'https://www.asme.org/codes-standards/find-codes-standards/b36-10m-welded-seamless-wrought-steel-pipe',
  },
  { id: 'min-fall-wftw', citation: 'Minimum fall 0.5 m (Water for the World RWS.4.D.5; CAT tipsheet)', confidence: 'found' },
  {
    id: 'lift-ratio-limit',
    citation: 'Lift ratio: rams for about 30 ft of lift per ft of fall (Ogden 1911); warn above 20',
    confidence: 'found',
    note: 'the 20 warning is common practice',
  },
  {
    id: 'design-flow-fraction',
    citation: 'Design with the lowest (dry-season) flow; take 0.5–0.8 of it to leave a residual stream flow',
    confidence: 'common-practice',
  },
  {
    id: 'fittings-allowance',
    citation: 'Add 10–25 % to the delivery pipe length for fittings (a US county on-site design worksheet uses 25 %)',
    confidence: 'found',
  },
  { id: 'delivery-friction-limit', citation: 'Keep delivery pipe friction within about 10 % of the static lift', confidence: 'common-practice' },
  { id: 'tank-one-day', citation: 'Tank ≥ 1 day of demand for a continuously running ram (Jeffery et al. 1992)', confidence: 'from-memory' },
  {
    id: 'nrcs-sd2006-1',
    citation: 'NRCS South Dakota Design Technical Note SD2006-1 (Taylor 2010): ≥ 3 days storage for an undependable supply',
    confidence: 'found',
  },
  {
    id: 'low-yield-storage',
    citation: 'Fact sheet "Water storage facilities for livestock watering systems": larger of 2 days or 6 h of peak demand',
    confidence: 'found',
  },
  { id: 'osu-anr-12', citation: 'Ohio State Ext. ANR-12 (Landefeld & Bettinger 2003): group watering tank ≥ 25 % of daily herd need', confidence: 'found' },
  { id: 'kstate-lwh', citation: 'K-State Research and Extension, Livestock Watering Handbook, Table 1', confidence: 'found' },
  { id: 'ndsu-as954', citation: 'NDSU Extension, livestock water requirements (2008 release, from AS-954): values at 88 °F / 80 °F', confidence: 'found' },
  {
    id: 'hindawi-2017',
    citation: 'J. Renewable Energy (Hindawi) 2017, Table 1 (sheep/goat 2 gal; chickens 6–12 gal per 100)',
    confidence: 'found',
    note: 'secondary source',
  },
  {
    id: 'older-us-table',
    citation: 'Older US livestock water table, reproduced online (sows 40–50 lb/day; laying hens 9 gal/100 at 90 °F)',
    confidence: 'found',
    note: 'secondary source',
  },
  {
    id: 'who-howard-bartram-2003',
    citation: 'Howard & Bartram (2003), Domestic Water Quantity, Service Level and Health, WHO/SDE/WSH/03.02, Table S1',
    confidence: 'from-memory',
    note: 'document found; 20 L basic access corroborated by WHO/UNICEF JMP',
    url: 'https://www.who.int/publications/i/item/WHO-SDE-WSH-03.02',
  },
  {
    id: 'sphere-2018',
    citation: 'Sphere Handbook (2018): at least 15 L per person per day',
    confidence: 'found',
    url: 'https://spherestandards.org/handbook-2018/',
  },
  {
    id: 'fao-56',
    citation: 'FAO Irrigation & Drainage Paper 56 (Allen et al. 1998): garden ET about 3–7 mm/day',
    confidence: 'from-memory',
    url: 'https://www.fao.org/3/x0490e/x0490e00.htm',
  },
  { id: 'continuity', citation: 'Continuity: mean velocity v = Q/A', confidence: 'computed' },
  { id: 'monte-carlo', citation: 'Monte Carlo propagation of reading uncertainties, seeded generator (mulberry32, Box–Muller)', confidence: 'common-practice' },
  {
    id: 'reading-uncertainty',
    citation: 'Per-method reading uncertainties: level 3 mm per set-up, hose 5 mm per step, clinometer 0.3 % of distance per leg',
    confidence: 'from-memory',
  },
  {
    id: 'ogden-1911-least-fall',
    citation: 'Ogden (1911), Rural Hygiene, Table XI: least fall 3 ft for the two smallest rams (No. 10, 15), 2 ft for the larger ones',
    confidence: 'found',
    note: 'the later rows\u2019 2 ft is read as the table\u2019s common figure',
  },
  {
    id: 'iversen-1975',
    citation:
      'Iversen (1975), "An analysis of the hydraulic ram", J. Fluids Eng. 97(2):191–196: the flow at waste-valve closure stays below the steady flow through the open valve',
    confidence: 'found',
    note: 'bibliographic data and the bound found; the loss coefficients used with it are from memory',
    url: 'https://doi.org/10.1115/1.3447251',
  },
  {
    id: 'minor-loss-coefficients',
    citation:
      'Minor loss coefficients: square-edged entrance K 0.5, open gate valve K 0.15, exit 1 (hydraulics handbooks, e.g. Crane TP-410); open waste valve K 2',
    confidence: 'from-memory',
    note: 'the waste valve figure is an estimate for a ram\u2019s open waste valve',
  },
  {
    id: 'ram-pressure-cases',
    citation:
      'In running, the delivery valve opens at about the delivery head; with the delivery blocked the full Joukowsky rise sits on the static fall (Joukowsky 1900; Wylie & Streeter 1993)',
    confidence: 'found',
    note: 'the 20 % allowance over the lift for the working peak is common practice, no source',
  },
  {
    id: 'plastic-cyclic-derating',
    citation:
      'Plastic pipe under repeated pressure cycles: rate it for half its static pressure class when it sees 10⁷–10⁸ cycles a year (fatigue design of PVC pressure pipe, AWWA M23; PE, PPI Handbook of PE Pipe ch. 6)',
    confidence: 'from-memory',
    url: 'https://plasticpipe.org/common/Uploaded%20files/Technical/PPI%20PEHandbook2022.pdf',
  },
  { id: 'malleable-fittings', citation: 'Threaded malleable-iron fittings (ASME B16.3): class 150 made to 6″, class 300 to 3″', confidence: 'from-memory' },
  {
    id: 'birge-1932',
    citation:
      'Birge (1932), "The calculation of errors by the method of least squares", Phys. Rev. 40:207: scale the weighted mean\u2019s σ by √(χ²/(n − 1)) when results disagree',
    confidence: 'found',
    url: 'https://doi.org/10.1103/PhysRev.40.207',
  },
  {
    id: 'efficiency-spread',
    citation:
      'Spread of ram efficiency between makes and set-ups: η typically 0.6, from 0.5 to 0.8 (Wikipedia "Hydraulic ram"; the 12 commercial rams of Tacke 1988, TU Delft, span a like range), taken as ±2σ: 12 % of η (1σ)',
    confidence: 'from-memory',
    note: 'the range is found; reading it as ±2σ is ours',
    url: 'https://es.ircwash.org/node/30938',
  },
  {
    id: 'float-gauging-spread',
    citation: 'Float gaugings carry about ±10 % at best (Herschy, Streamflow Measurement; USBR Water Measurement Manual ch. 10)',
    confidence: 'from-memory',
  },
  {
    id: 'gravity-flow',
    citation: 'Gravity supply: the tank below the intake fills by the difference in level, less Hazen–Williams friction (EPANET 2 manual, Table 3.1)',
    confidence: 'computed',
  },
  {
    id: 'low-lift-ratio',
    citation:
      'Below its published range a ram\u2019s delivered share q/Q is held at the range\u2019s first value, not extended (the share rises as the ratio falls; holding it understates delivery)',
    confidence: 'common-practice',
  },
  {
    id: 'constant-efficiency-range',
    citation:
      'Ram efficiency falls off "particularly when the ratio exceeds 1:12" (International Encyclopedia, "Hydraulic Ram"): a constant efficiency is stated up to 12',
    confidence: 'found',
  },
  {
    id: 'parallel-rams',
    citation: 'Where one ram cannot use the water needed, several rams in parallel, each on its own drive pipe, share one delivery pipe (Watt 1975, Part I)',
    confidence: 'from-memory',
  },
  { id: 'common-practice', citation: 'Engineering judgement of the trade', confidence: 'common-practice' },
] as const satisfies readonly Source[];

export type SourceId = (typeof list)[number]['id'];

export const SOURCES: Readonly<Record<SourceId, Source>> = Object.fromEntries(list.map((s) => [s.id, s])) as Record<SourceId, Source>;

/** Looks up sources by id, in first-use order without duplicates. */
export function sourcesFor(ids: Iterable<SourceId>): Source[] {
  return [...new Set(ids)].map((id) => SOURCES[id]);
}

/** A source's address by id (also for ids stored by older screenings); null when it has none or the id is unknown. */
export function sourceUrl(id: string): string | null {
  return (SOURCES as Readonly<Record<string, Source | undefined>>)[id]?.url ?? null;
}
