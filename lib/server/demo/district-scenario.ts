import 'server-only';
import type { DemandKind } from '@/lib/engine/demand';
import type { VisitStatus } from '@/lib/shared/domain';

// The rest of Wenlow Vale around the named demo farms: two more advisors, more farmers, and a season
// of visits in every state. All invented: people, farms, places and readings.

export const DISTRICT_ADVISORS = [
  { key: 'user:dilys', name: 'Dilys Marchbank', email: 'dilys@wenlow-water.test' },
  { key: 'user:rafael', name: 'Rafael Oyelaran', email: 'rafael@wenlow-water.test' },
] as const;

export const DISTRICT_FARMERS = [
  { key: 'user:bronwen', name: 'Bronwen Ashdale' },
  { key: 'user:idris', name: 'Idris Calloway' },
  { key: 'user:mabli', name: 'Mabli Fenwright' },
  { key: 'user:osian', name: 'Osian Thornbury' },
  { key: 'user:ffion', name: 'Ffion Kettleby' },
  { key: 'user:aled', name: 'Aled Merriweather' },
  { key: 'user:nia', name: 'Nia Harrowgate' },
  { key: 'user:kwame', name: 'Kwame Addy-Rowe' },
  { key: 'user:elin', name: 'Elin Tudwal' },
  { key: 'user:jonah', name: 'Jonah Pellow' },
  { key: 'user:seren', name: 'Seren Blakemoor' },
  { key: 'user:tomos', name: 'Tomos Vardy' },
].map((f) => ({ ...f, email: `${f.key.slice(5)}@wenlow-water.test` }));

/** The kind of site a visit found: which screening the invented readings lead to. */
export type SiteKind = 'go' | 'conditional' | 'no-go' | 'gravity';

export interface DistrictFarm {
  name: string;
  area: string;
  demand: { kind: DemandKind; count: number }[];
  /** Null: the farm is on the books with no visit yet. */
  status: VisitStatus | null;
  /** Days from today of the planned visit; null when not yet agreed. */
  plannedInDays: number | null;
  advisor: 'user:dilys' | 'user:rafael' | null;
  site?: SiteKind;
  notes?: string;
  /** What happened after the sheet went out. */
  story?: 'unread' | 'question-open' | 'question-answered' | 'send-failed';
  declineReason?: string;
  /** A position the office typed wrong (far outside the district), for the map's outlier note. */
  strayPosition?: { lat: number; lon: number };
}

const HOUSE = (n: number) => ({ kind: 'person-tap-on-plot' as const, count: n });

// Planned days run from early summer (about five months back) to a month ahead: the earlier a
// visit, the further along it is.
export const DISTRICT_FARMS: DistrictFarm[] = [
  // Running rams, commissioned in late summer.
  {
    name: 'Gorsedd Fach',
    area: 'Upper Wenlow',
    demand: [{ kind: 'sheep', count: 120 }, HOUSE(2)],
    status: 'commissioned',
    plannedInDays: -150,
    advisor: 'user:dilys',
    site: 'go',
  },
  {
    name: 'Pant-y-Brwyn',
    area: 'Nant Gwern valley',
    demand: [{ kind: 'beef-cow-nursing', count: 18 }, HOUSE(4)],
    status: 'commissioned',
    plannedInDays: -138,
    advisor: 'user:rafael',
    site: 'go',
  },
  // Built, waiting for the commissioning check.
  {
    name: 'Hollins Mill Croft',
    area: 'Wenlow mouth',
    demand: [{ kind: 'goat', count: 30 }, HOUSE(3), { kind: 'garden-m2', count: 80 }],
    status: 'installed',
    plannedInDays: -120,
    advisor: 'user:rafael',
    site: 'go',
  },
  {
    name: 'Maesllwyd',
    area: 'Rhosfach common',
    demand: [{ kind: 'growing-cattle', count: 16 }],
    status: 'installed',
    plannedInDays: -112,
    advisor: 'user:dilys',
    site: 'conditional',
  },
  // The farmer said go ahead.
  {
    name: 'Thornfold',
    area: 'Pengarth ridge',
    demand: [{ kind: 'dairy-cow-lactating', count: 8 }, HOUSE(5)],
    status: 'agreed',
    plannedInDays: -98,
    advisor: 'user:dilys',
    site: 'go',
  },
  {
    name: 'Blaen Ceulan',
    area: 'Nant Gwern valley',
    demand: [{ kind: 'sheep', count: 90 }],
    status: 'agreed',
    plannedInDays: -91,
    advisor: 'user:rafael',
    site: 'conditional',
  },
  {
    name: 'Ashgrove Smallholding',
    area: 'Upper Wenlow',
    demand: [{ kind: 'laying-hen', count: 150 }, HOUSE(3), { kind: 'garden-m2', count: 200 }],
    status: 'agreed',
    plannedInDays: -84,
    advisor: 'user:rafael',
    site: 'go',
  },
  // The farmer said not now.
  {
    name: 'Tŷ Draenen',
    area: 'Pengarth ridge',
    demand: [{ kind: 'beef-cow-nursing', count: 10 }],
    status: 'declined',
    plannedInDays: -80,
    advisor: 'user:dilys',
    site: 'conditional',
    declineReason: 'We are selling the suckler herd next spring; ask us again after that.',
  },
  {
    name: 'Upper Cefnhir',
    area: 'Rhosfach common',
    demand: [{ kind: 'sheep', count: 200 }, HOUSE(2)],
    status: 'declined',
    plannedInDays: -73,
    advisor: 'user:rafael',
    site: 'go',
    declineReason: 'The pipe would cross the neighbour’s field and he has not agreed yet.',
  },
  // Read by the farmer, no decision yet.
  {
    name: 'Nantgwern Isaf',
    area: 'Nant Gwern valley',
    demand: [{ kind: 'growing-cattle', count: 20 }, HOUSE(4)],
    status: 'acknowledged',
    plannedInDays: -60,
    advisor: 'user:rafael',
    site: 'go',
    story: 'question-answered',
  },
  {
    name: 'Rowan Leys',
    area: 'Upper Wenlow',
    demand: [{ kind: 'goat', count: 45 }, HOUSE(2)],
    status: 'acknowledged',
    plannedInDays: -54,
    advisor: 'user:dilys',
    site: 'conditional',
    story: 'question-open',
  },
  {
    name: 'Brynhafren',
    area: 'Wenlow mouth',
    demand: [{ kind: 'sheep', count: 70 }],
    status: 'acknowledged',
    plannedInDays: -47,
    advisor: 'user:dilys',
    site: 'go',
  },
  // Sent, not read yet.
  {
    name: 'Coed-y-Garth',
    area: 'Pengarth ridge',
    demand: [{ kind: 'beef-cow-nursing', count: 12 }, HOUSE(3)],
    status: 'sent',
    plannedInDays: -40,
    advisor: 'user:rafael',
    site: 'go',
    story: 'unread',
  },
  {
    name: 'Fennick’s Bottom',
    area: 'Wenlow mouth',
    demand: [{ kind: 'dairy-cow-lactating', count: 6 }],
    status: 'sent',
    plannedInDays: -33,
    advisor: 'user:dilys',
    site: 'conditional',
    story: 'unread',
  },
  {
    name: 'Glanrhos',
    area: 'Rhosfach common',
    demand: [{ kind: 'growing-cattle', count: 9 }, HOUSE(2)],
    status: 'sent',
    plannedInDays: -27,
    advisor: 'user:rafael',
    site: 'go',
    story: 'question-open',
  },
  {
    name: 'Wethercote',
    area: 'Upper Wenlow',
    demand: [
      { kind: 'sheep', count: 60 },
      { kind: 'garden-m2', count: 50 },
    ],
    status: 'sent',
    plannedInDays: -22,
    advisor: 'user:dilys',
    site: 'gravity',
  },
  // Screened, not sent yet (one send failed at the mail server).
  {
    name: 'Cae Mawr',
    area: 'Nant Gwern valley',
    demand: [{ kind: 'beef-cow-nursing', count: 25 }, HOUSE(6)],
    status: 'screened',
    plannedInDays: -25,
    advisor: 'user:rafael',
    site: 'no-go',
    notes: 'A long lift to the yard from a small stream.',
  },
  {
    name: 'Pennant Lodge',
    area: 'Pengarth ridge',
    demand: [{ kind: 'goat', count: 25 }, HOUSE(2)],
    status: 'screened',
    plannedInDays: -21,
    advisor: 'user:dilys',
    site: 'go',
    story: 'send-failed',
  },
  {
    name: 'Llwyn Onn',
    area: 'Rhosfach common',
    demand: [{ kind: 'sheep', count: 80 }],
    status: 'screened',
    plannedInDays: -18,
    advisor: 'user:dilys',
    site: 'gravity',
  },
  {
    name: 'Harrow End',
    area: 'Wenlow mouth',
    demand: [{ kind: 'growing-cattle', count: 30 }, HOUSE(5)],
    status: 'screened',
    plannedInDays: -16,
    advisor: 'user:rafael',
    site: 'no-go',
  },
  {
    name: 'Sunnybank Paddocks',
    area: 'Upper Wenlow',
    demand: [{ kind: 'laying-hen', count: 60 }, HOUSE(4)],
    status: 'screened',
    plannedInDays: -14,
    advisor: 'user:rafael',
    site: 'conditional',
  },
  // Walked, readings still coming in from the phone.
  { name: 'Dolwen', area: 'Nant Gwern valley', demand: [{ kind: 'sheep', count: 50 }], status: 'surveyed', plannedInDays: -11, advisor: 'user:dilys' },
  {
    name: 'Brackenrigg',
    area: 'Pengarth ridge',
    demand: [{ kind: 'beef-cow-nursing', count: 8 }],
    status: 'surveyed',
    plannedInDays: -10,
    advisor: 'user:rafael',
  },
  // Booked: three of them late.
  {
    name: 'Penlan Uchaf',
    area: 'Rhosfach common',
    demand: [{ kind: 'goat', count: 20 }, HOUSE(3)],
    status: 'scheduled',
    plannedInDays: -9,
    advisor: 'user:dilys',
    notes: 'Farmer away at the show that week.',
  },
  { name: 'Alder Carr', area: 'Wenlow mouth', demand: [{ kind: 'growing-cattle', count: 14 }], status: 'scheduled', plannedInDays: -5, advisor: 'user:rafael' },
  { name: 'Tyddyn Hen', area: 'Upper Wenlow', demand: [{ kind: 'sheep', count: 40 }, HOUSE(2)], status: 'scheduled', plannedInDays: -4, advisor: 'user:dilys' },
  {
    name: 'Stonechat Farm',
    area: 'Pengarth ridge',
    demand: [{ kind: 'dairy-cow-lactating', count: 10 }],
    status: 'scheduled',
    plannedInDays: 3,
    advisor: 'user:rafael',
  },
  { name: 'Rhyd-y-Fedw', area: 'Nant Gwern valley', demand: [{ kind: 'sheep', count: 110 }], status: 'scheduled', plannedInDays: 8, advisor: 'user:dilys' },
  {
    name: 'Meadowsweet Holding',
    area: 'Wenlow mouth',
    demand: [{ kind: 'laying-hen', count: 40 }, HOUSE(2), { kind: 'garden-m2', count: 150 }],
    status: 'scheduled',
    plannedInDays: 15,
    advisor: 'user:rafael',
  },
  {
    name: 'Crugiau',
    area: 'Rhosfach common',
    demand: [{ kind: 'beef-cow-nursing', count: 20 }],
    status: 'scheduled',
    plannedInDays: 24,
    advisor: 'user:dilys',
  },
  // Asked for, not yet planned; one typed far outside the district.
  { name: 'Bwlch Gwynt', area: 'Upper Wenlow', demand: [{ kind: 'sheep', count: 75 }], status: 'requested', plannedInDays: null, advisor: null },
  {
    name: 'Heronsford',
    area: 'Wenlow mouth',
    demand: [{ kind: 'growing-cattle', count: 12 }, HOUSE(3)],
    status: 'requested',
    plannedInDays: null,
    advisor: null,
  },
  {
    name: 'Tŷ Isaf',
    area: 'Pengarth ridge',
    demand: [{ kind: 'goat', count: 15 }],
    status: 'requested',
    plannedInDays: null,
    advisor: null,
    notes: 'Position typed from the farmer’s letter: check it.',
    strayPosition: { lat: 51.0412, lon: -0.5127 },
  },
  {
    name: 'Foxhole Cottage',
    area: 'Nant Gwern valley',
    demand: [HOUSE(4), { kind: 'garden-m2', count: 120 }],
    status: 'requested',
    plannedInDays: 30,
    advisor: 'user:rafael',
  },
  // On the books, no visit asked for yet.
  { name: 'Clawdd Coch', area: 'Upper Wenlow', demand: [{ kind: 'sheep', count: 45 }], status: null, plannedInDays: null, advisor: null },
  { name: 'Yew Tree Fold', area: 'Rhosfach common', demand: [], status: null, plannedInDays: null, advisor: null },
  // Called off: the farm went onto the mains.
  {
    name: 'Quarry Bank',
    area: 'Wenlow mouth',
    demand: [{ kind: 'sheep', count: 30 }],
    status: 'cancelled',
    plannedInDays: -66,
    advisor: 'user:dilys',
    notes: 'Connected to the mains in the summer.',
  },
];
