import 'server-only';
import type { Role, VisitStatus } from '@/lib/shared/domain';
import type { DemandKind } from '@/lib/engine/demand';

// An invented district for the demo: Wenlow Vale, a hill valley of small mixed farms whose
// springs and side-creeks fall to the Wenlow river. Every person, farm and reading is made up.

export const DEMO_PASSWORD = 'fallbook-demo';

export const DEMO_ORGANISATION = {
  key: 'org:wenlow',
  name: 'Wenlow Vale Smallholder Water Trust',
  district: 'Wenlow Vale',
};

export const DEMO_PEOPLE: { key: string; name: string; email: string; role: Role }[] = [
  { key: 'user:maren', name: 'Maren Holt', email: 'maren@wenlow-water.test', role: 'coordinator' },
  { key: 'user:tobias', name: 'Tobias Kerr', email: 'tobias@wenlow-water.test', role: 'advisor' },
  { key: 'user:ines', name: 'Ines Achterberg', email: 'ines@wenlow-water.test', role: 'advisor' },
  { key: 'user:gwen', name: 'Gwen Pryce', email: 'gwen@wenlow-water.test', role: 'farmer' },
  { key: 'user:hallie', name: 'Hallie Brandt', email: 'hallie@wenlow-water.test', role: 'farmer' },
  { key: 'user:samuel', name: 'Samuel Otieno', email: 'samuel@wenlow-water.test', role: 'farmer' },
];

export const DEMO_FARMS: {
  key: string;
  owner: string;
  name: string;
  area: string;
  lat: number;
  lon: number;
  notes: string;
  demand: { kind: DemandKind; count: number; note?: string }[];
}[] = [
  {
    key: 'farm:brandt-hollow',
    owner: 'user:hallie',
    name: 'Brandt Hollow',
    area: 'Lower Wenlow, east bank',
    lat: 52.41872,
    lon: -3.61544,
    notes: 'Herd waters at the river today; banks are eroding.',
    demand: [
      { kind: 'beef-cow-nursing', count: 14 },
      { kind: 'person-tap-on-plot', count: 4 },
    ],
  },
  {
    key: 'farm:pryce-upper',
    owner: 'user:gwen',
    name: "Pryce's Upper Field",
    area: 'Cwm Ddu side-creek',
    lat: 52.4331,
    lon: -3.64021,
    notes: 'Goats and a house on the ridge, 30-odd metres above the creek.',
    demand: [
      { kind: 'goat', count: 40 },
      { kind: 'person-tap-on-plot', count: 3 },
      { kind: 'garden-m2', count: 60 },
    ],
  },
  {
    key: 'farm:cwm-rhyd',
    owner: 'user:gwen',
    name: 'Cwm Rhyd paddock',
    area: 'Cwm Ddu side-creek',
    lat: 52.43602,
    lon: -3.6448,
    notes: 'Summer grazing only.',
    demand: [{ kind: 'sheep', count: 60 }],
  },
  {
    key: 'farm:otieno-croft',
    owner: 'user:samuel',
    name: 'Otieno Orchard Croft',
    area: 'Hafod spring line',
    lat: 52.4059,
    lon: -3.59877,
    notes: 'Orchard, hens and a family of five.',
    demand: [
      { kind: 'person-tap-on-plot', count: 5 },
      { kind: 'laying-hen', count: 80 },
      { kind: 'garden-m2', count: 120 },
    ],
  },
  {
    key: 'farm:hafod-lower',
    owner: 'user:samuel',
    name: 'Hafod Lower Meadow',
    area: 'Hafod spring line',
    lat: 52.40391,
    lon: -3.60052,
    notes: 'Young stock in the lower meadow; the spring rises above it.',
    demand: [{ kind: 'growing-cattle', count: 10 }],
  },
  {
    key: 'farm:lark-spinney',
    owner: 'user:samuel',
    name: 'Lark Spinney',
    area: 'Hafod spring line',
    lat: 52.40211,
    lon: -3.60412,
    notes: 'Dairy heifers over winter.',
    demand: [{ kind: 'growing-cattle', count: 12 }],
  },
];

export const DEMO_VISITS: {
  key: string;
  farm: string;
  advisor: string | null;
  plannedInDays: number | null;
  status: VisitStatus;
  notes: string;
}[] = [
  {
    key: 'visit:brandt-hollow',
    farm: 'farm:brandt-hollow',
    advisor: 'user:tobias',
    plannedInDays: -12,
    status: 'sent',
    notes: 'Spring-fed side-creek above the river meadow.',
  },
  { key: 'visit:pryce-upper', farm: 'farm:pryce-upper', advisor: 'user:tobias', plannedInDays: -3, status: 'screened', notes: 'Steep tank run to the ridge.' },
  {
    key: 'visit:hafod-lower',
    farm: 'farm:hafod-lower',
    advisor: 'user:tobias',
    plannedInDays: -6,
    status: 'screened',
    notes: 'Trough below the spring: maybe no pump at all.',
  },
  { key: 'visit:otieno-croft', farm: 'farm:otieno-croft', advisor: 'user:ines', plannedInDays: 6, status: 'scheduled', notes: '' },
  {
    key: 'visit:lark-spinney',
    farm: 'farm:lark-spinney',
    advisor: 'user:ines',
    plannedInDays: -2,
    status: 'scheduled',
    notes: 'Farmer asked to reschedule once.',
  },
  { key: 'visit:cwm-rhyd', farm: 'farm:cwm-rhyd', advisor: null, plannedInDays: null, status: 'requested', notes: '' },
];
