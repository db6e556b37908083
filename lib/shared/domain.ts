// Words of the domain shared by the database, the API, the forms and the pages.

export const ROLES = ['coordinator', 'advisor', 'farmer'] as const;
export type Role = (typeof ROLES)[number];

/** A visit's life, from the farmer's request to a running ram. Order matters (follow-up board). */
export const VISIT_STATUSES = [
  'requested',
  'scheduled',
  'surveyed',
  'screened',
  'sent',
  'acknowledged',
  'agreed',
  'declined',
  'installed',
  'commissioned',
  'cancelled',
] as const;
export type VisitStatus = (typeof VISIT_STATUSES)[number];

export const VISIT_STATUS_LABELS: Record<VisitStatus, string> = {
  requested: 'Needs requested',
  scheduled: 'Visit booked',
  surveyed: 'Site walked',
  screened: 'Screened',
  sent: 'Sheet sent',
  acknowledged: 'Farmer has read it',
  agreed: 'Farmer said go ahead',
  declined: 'Farmer said not now',
  installed: 'Ram installed',
  commissioned: 'Running, checked',
  cancelled: 'Cancelled',
};

/** Visits out in the field: what a coordinator's phone holds (an advisor's holds all theirs). */
export const FIELD_VISIT_STATUSES: readonly VisitStatus[] = ['scheduled', 'surveyed'];

export const POINT_ROLES = ['intake', 'pump', 'tank', 'station', 'source', 'other'] as const;
export type PointRole = (typeof POINT_ROLES)[number];

export const UNIT_SYSTEMS = ['metric', 'us'] as const;
export type UnitSystem = (typeof UNIT_SYSTEMS)[number];

export const VERDICTS = ['go', 'conditional', 'no-go', 'gravity'] as const;
export type Verdict = (typeof VERDICTS)[number];

/** The verdict in words, everywhere it shows: sheet, PDF, preview, office, map, filters and CSV. */
export const VERDICT_WORDS: Record<Verdict, string> = { go: 'Go', conditional: 'Go, with conditions', 'no-go': 'No-go', gravity: 'No pump needed' };
/** The verdict's colour (never alone: word and shape go with it); gravity takes the creek's blue. */
export const VERDICT_COLOURS: Record<Verdict, string> = { go: '#3E5B1E', conditional: '#6F4700', 'no-go': '#8C2F10', gravity: '#184F69' };

export const HOME_BY_ROLE: Record<Role, string> = {
  coordinator: '/office',
  advisor: '/field',
  farmer: '/farm',
};

/** The signed-in person as the server knows them (re-read from the database each request). */
export interface SessionUser {
  id: string;
  organisationId: string;
  role: Role;
  name: string;
  email: string;
  units: UnitSystem;
}
