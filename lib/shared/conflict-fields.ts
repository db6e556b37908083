// How a parked sync conflict is put to the advisor: the record in words, each field by its form
// label, numbers converted to the advisor's units with the unit beside them (values are SI).
import type { UnitSystem } from './domain';
import { showQuantity, type QuantityKind } from './display/quantities';
import type { SyncEntity } from './schemas/sync';

const ENTITY_NAMES: Record<SyncEntity, string> = {
  visit: 'the visit',
  waterSource: 'a water source',
  flowMeasurement: 'a flow measurement',
  fallReading: 'a fall reading',
  point: 'a point',
  photo: 'a photo',
  demandLine: 'a demand line',
  pipeRun: 'a pipe run',
  commissioning: 'a commissioning check',
};

const FIELDS: Record<string, { label: string; quantity?: QuantityKind }> = {
  notes: { label: 'Notes' },
  status: { label: 'State' },
  visitedAt: { label: 'Visited at' },
  name: { label: 'Name' },
  kind: { label: 'Kind' },
  sourceId: { label: 'Source' },
  takenAt: { label: 'Taken at' },
  measurement: { label: 'Method and trials' },
  purpose: { label: 'Purpose' },
  seq: { label: 'Order' },
  bookedFrom: { label: 'Booked from' },
  run: { label: 'Readings of the run' },
  role: { label: 'Role' },
  label: { label: 'Label' },
  lat: { label: 'Latitude' },
  lon: { label: 'Longitude' },
  accuracyM: { label: 'GPS accuracy', quantity: 'length' },
  altitudeM: { label: 'Altitude', quantity: 'length' },
  altitudeAccuracyM: { label: 'Altitude accuracy', quantity: 'length' },
  chainageM: { label: 'Distance along the route', quantity: 'length' },
  capturedAt: { label: 'Captured at' },
  reducedLevelM: { label: 'Reduced level', quantity: 'length' },
  flags: { label: 'Flags' },
  pointId: { label: 'Point' },
  caption: { label: 'Caption' },
  count: { label: 'How many', quantity: 'count' },
  litresPerHeadPerDay: { label: 'Water each per day', quantity: 'litresPerDay' },
  figureSource: { label: 'Where the figure comes from' },
  note: { label: 'Note' },
  lengthM: { label: 'Length along the route', quantity: 'length' },
  diameterMm: { label: 'Inside diameter', quantity: 'diameter' },
  driveLpm: { label: 'Drive flow (L/min)' },
  deliveredLpm: { label: 'Delivered flow (L/min)' },
  beatsPerMinute: { label: 'Beats per minute' },
  liftM: { label: 'Measured lift', quantity: 'length' },
  fallM: { label: 'Fall', quantity: 'length' },
  drivePipeMaterial: { label: 'Drive pipe material' },
  wasteValveStrokeMm: { label: 'Waste valve stroke', quantity: 'stroke' },
  material: { label: 'Material' },
  pressureClass: { label: 'Pressure class' },
  deletedAt: { label: 'Deleted on the server' },
  // Readings inside a flow measurement or a fall run (the keys the shared schemas use).
  volumeL: { label: 'Bucket volume', quantity: 'volume' },
  seconds: { label: 'Seconds', quantity: 'time' },
  headM: { label: 'Head over the notch', quantity: 'length' },
  crestWidthM: { label: 'Crest width', quantity: 'length' },
  distanceM: { label: 'Float run length', quantity: 'length' },
  areaM2: { label: 'Cross-section area', quantity: 'area' },
  notchAngleDeg: { label: 'Notch angle', quantity: 'angle' },
  coefficient: { label: 'Float coefficient' },
  trials: { label: 'Trials' },
  backsightM: { label: 'Backsight', quantity: 'length' },
  foresightM: { label: 'Foresight', quantity: 'length' },
  rows: { label: 'Stations' },
  returnRows: { label: 'Return stations' },
  routeLengthM: { label: 'Route length', quantity: 'length' },
  upperReadingM: { label: 'Reading at the upper end', quantity: 'length' },
  lowerReadingM: { label: 'Reading at the lower end', quantity: 'length' },
  steps: { label: 'Hose steps' },
  legs: { label: 'Clinometer legs' },
  slopeDistanceM: { label: 'Slope distance', quantity: 'length' },
  angleBelowHorizontalDeg: { label: 'Angle', quantity: 'angle' },
  startAltitudeM: { label: 'Altitude at the start', quantity: 'length' },
  endAltitudeM: { label: 'Altitude at the end', quantity: 'length' },
  horizontalAccuracyM: { label: 'Horizontal accuracy', quantity: 'length' },
  verticalAccuracyM: { label: 'Vertical accuracy', quantity: 'length' },
  startPressureHPa: { label: 'Pressure at the start', quantity: 'pressureHPa' },
  endPressureHPa: { label: 'Pressure at the end', quantity: 'pressureHPa' },
  airTemperatureC: { label: 'Air temperature' },
  staticLiftM: { label: 'Height of the tank above the pump', quantity: 'length' },
  uncertaintyM: { label: 'Uncertainty', quantity: 'length' },
  liftMethod: { label: 'How the lift was found' },
  result: { label: 'The run' },
  method: { label: 'Method' },
  season: { label: 'Season' },
  width: { label: 'Photo width' },
  height: { label: 'Photo height' },
  bytes: { label: 'Photo size' },
  mime: { label: 'Photo type' },
};

/** "a pipe run (delivery)", "a water source (Hafod spring)": which record the conflict is about. */
export function describeRecord(entity: SyncEntity, record: Record<string, unknown>): string {
  const detail = [record.purpose, record.name, record.label, record.caption].find((v) => typeof v === 'string' && v.trim() !== '');
  return detail ? `${ENTITY_NAMES[entity]} (${String(detail)})` : ENTITY_NAMES[entity];
}

/** The form's label of a field (the field's key when unknown). */
export function fieldLabel(field: string): string {
  return FIELDS[field]?.label ?? field;
}

/** A field's label and quantity, when the vocabulary knows it. */
export function fieldWords(field: string): { label: string; quantity?: QuantityKind } | undefined {
  return Object.hasOwn(FIELDS, field) ? FIELDS[field] : undefined;
}

/** A field's value as the advisor reads it: in their units with the unit, or plain text. */
export function showFieldValue(field: string, value: unknown, units: UnitSystem): string {
  if (value === null || value === undefined || value === '') return '—';
  const quantity = FIELDS[field]?.quantity;
  if (quantity && typeof value === 'number') return showQuantity(value, quantity, units);
  return typeof value === 'object' ? JSON.stringify(value) : String(value);
}
