import type { Model, ModelStatic } from 'sequelize';
import { columnsOf, quote, utcDate, type TxConnection } from './batch-insert';

// The sync routes read and build hundreds of rows per request only to copy values in and out:
// Sequelize instances (setters, change tracking, date parsing per value) cost more than the
// database's own work. These rows keep the instance's get/set shape over a plain object.

type Values = Record<string, unknown>;

/** A row without a model instance: attribute-keyed values with get/set like an instance's. */
export class PlainRow {
  constructor(readonly values: Values) {}

  get(key?: string | { plain: true }): unknown {
    return typeof key === 'string' ? this.values[key] : { ...this.values };
  }

  set(key: string | Values, value?: unknown): void {
    if (typeof key === 'string') this.values[key] = value;
    else Object.assign(this.values, key);
  }

  get id(): string {
    return this.values.id as string;
  }
  get rev(): number {
    return Number(this.values.rev);
  }
  get deletedAt(): Date | null {
    return (this.values.deletedAt as Date | null | undefined) ?? null;
  }
  get updatedAt(): Date {
    return this.values.updatedAt as Date;
  }
}

const staticDefaults = new WeakMap<ModelStatic<Model>, Values>();

/** The model's plain default values (a generated default, such as a UUID, is left to the caller). */
function defaultsOf(model: ModelStatic<Model>): Values {
  let defaults = staticDefaults.get(model);
  if (!defaults) {
    defaults = {};
    for (const [attribute, a] of Object.entries(model.getAttributes())) {
      const value = a.defaultValue;
      if (value === undefined || typeof value === 'function' || (value !== null && typeof value === 'object')) continue;
      defaults[attribute] = value;
    }
    staticDefaults.set(model, defaults);
  }
  return defaults;
}

/** A new row with the model's defaults under the given values (what `model.build` would hold). */
export function buildRow(model: ModelStatic<Model>, values: Values): PlainRow {
  // Copied key by key in the values' order (one object shape for every row of a batch: fast).
  const row: Values = {};
  for (const key in values) if (values[key] !== undefined) row[key] = values[key];
  const defaults = defaultsOf(model);
  for (const key in defaults) if (row[key] === undefined) row[key] = defaults[key];
  return new PlainRow(row);
}

const selects = new WeakMap<ModelStatic<Model>, { list: string; json: string[]; dates: string[] }>();

/** The model's select list (column AS attribute), its JSON and its date-time attributes, built once per model. */
function selectOf(model: ModelStatic<Model>): { list: string; json: string[]; dates: string[] } {
  let select = selects.get(model);
  if (!select) {
    const columns = columnsOf(model);
    select = {
      list: columns.map((c) => (c.field === c.attribute ? quote(c.field) : `${quote(c.field)} AS ${quote(c.attribute)}`)).join(', '),
      json: columns.filter((c) => c.json).map((c) => c.attribute),
      dates: columns.filter((c) => c.date).map((c) => c.attribute),
    };
    selects.set(model, select);
  }
  return select;
}

export interface SelectRowsOptions {
  /** SQL after WHERE (with ? placeholders), e.g. "visit_id IN (?) AND rev > ? ORDER BY rev LIMIT ?". */
  where: string;
  replacements: unknown[];
  /** SELECT … FOR UPDATE (on a transaction's connection). */
  lock?: boolean;
}

/**
 * The model's rows matching `where`, as plain rows: every stored column under its attribute name,
 * JSON columns parsed, date-times as Dates, numbers as numbers. Sent straight on the given
 * connection (a transaction's, or one held with withConnection), so statements started together go
 * out in the order they were started.
 */
export async function selectRows(on: TxConnection, model: ModelStatic<Model>, options: SelectRowsOptions): Promise<PlainRow[]> {
  const { list, json, dates } = selectOf(model);
  const sql = `SELECT ${list} FROM ${quote(model.getTableName() as string)} WHERE ${options.where}${options.lock ? ' FOR UPDATE' : ''}`;
  const rows = await on.query<Values[]>(sql, options.replacements);
  const plain: PlainRow[] = [];
  for (const row of rows) {
    for (const key of json) {
      const value = row[key];
      if (typeof value === 'string') row[key] = JSON.parse(value);
    }
    // The connection gives date-times as text (see txConnection).
    for (const key of dates) {
      const value = row[key];
      if (typeof value === 'string') row[key] = utcDate(value);
    }
    plain.push(new PlainRow(row));
  }
  return plain;
}
