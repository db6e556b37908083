import type { QueryInterface } from 'sequelize';

type Ctx = { context: QueryInterface };

// Indexes for the office at scale (thousands of visits in one organisation, where the organisation
// alone selects nearly every row). Each starts (organisation_id, deleted_at) so the live visits of one
// organisation are one range, and carries the filter and sort columns after it, so counts, the export's
// ordered id list and the follow-up board's counts read the index alone (the primary key rides along).
const INDEXES: { table: string; fields: string[]; name: string }[] = [
  // The default list order (planned date), its count, the verdict filters' outer scan, the date range.
  { table: 'visits', fields: ['organisation_id', 'deleted_at', 'planned_on'], name: 'visits_org_live_planned' },
  // The status filter and the overdue filter (requested/scheduled before today), in planned order.
  { table: 'visits', fields: ['organisation_id', 'deleted_at', 'status', 'planned_on'], name: 'visits_org_live_status_planned' },
  // The advisor filter (and "not assigned") in planned order, the export by advisor, the board's counts by advisor and status.
  { table: 'visits', fields: ['organisation_id', 'deleted_at', 'advisor_id', 'planned_on', 'status'], name: 'visits_org_live_advisor' },
  // The farm-name search and sort joined to the farmer: the organisation's farms from the index alone.
  { table: 'farms', fields: ['organisation_id', 'name', 'owner_id'], name: 'farms_org_name_owner' },
];

export async function up({ context: qi }: Ctx) {
  for (const index of INDEXES) await qi.addIndex(index.table, index.fields, { name: index.name });
}

export async function down({ context: qi }: Ctx) {
  for (const index of [...INDEXES].reverse()) await qi.removeIndex(index.table, index.name);
}
