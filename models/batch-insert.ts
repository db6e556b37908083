import type { Model, ModelStatic, Sequelize, Transaction } from 'sequelize';

// The push writes hundreds of rows per batch: building them through Sequelize (instances, escaping
// every value into one SQL string) cost more than the database's own work. These go through the
// transaction's own connection as one prepared statement executed in bulk (the connector's batch).

export interface Column {
  attribute: string;
  field: string;
  json: boolean;
  date: boolean;
  decimal: boolean;
}

const columnCache = new WeakMap<ModelStatic<Model>, Column[]>();

const FRACTIONAL = new Set(['DOUBLE PRECISION', 'DOUBLE', 'FLOAT', 'REAL', 'DECIMAL']);

/** The model's stored columns (attribute, column name, JSON or date-time), read once per model. */
export function columnsOf(model: ModelStatic<Model>): Column[] {
  const cached = columnCache.get(model);
  if (cached) return cached;
  const columns = Object.entries(model.getAttributes())
    .filter(([, a]) => (a.type as { key?: string }).key !== 'VIRTUAL')
    .map(([attribute, a]) => {
      const key = (a.type as { key?: string }).key;
      return { attribute, field: a.field ?? attribute, json: key === 'JSON', date: key === 'DATE', decimal: FRACTIONAL.has(key ?? '') };
    });
  columnCache.set(model, columns);
  return columns;
}

// The app's connections run in UTC (timezone '+00:00'): write DATETIMEs the way Sequelize does.
// A batch's rows share a few instants (its own time, the phone's capture times): their text is
// kept for the next cells.
const dateTexts = new Map<number, string>();
function sqlDate(d: Date): string {
  const time = d.getTime();
  let text = dateTexts.get(time);
  if (text === undefined) {
    if (dateTexts.size >= 256) dateTexts.clear();
    text = d.toISOString().replace('T', ' ').replace('Z', '');
    dateTexts.set(time, text);
  }
  return text;
}

/**
 * A cell the database computes: `sql` stands in for the column's placeholder and takes `values`.
 * Every row of one statement must give the column the same `sql` (one prepared statement).
 */
export class Computed {
  constructor(
    readonly sql: string,
    readonly values: unknown[],
  ) {}
}

function cell(column: Column, value: unknown): unknown {
  if (value === undefined || value === null) return null;
  if (column.json) return JSON.stringify(value);
  if (column.date && value instanceof Date) return sqlDate(value);
  if (column.date && typeof value === 'string' && /T.*Z$/.test(value)) return sqlDate(new Date(value));
  // The connector binds a whole number as INT and any other as DOUBLE, and starts a new bulk packet
  // (one more round trip) whenever a column's type changes from one row to the next: 230 then 230.5.
  // As text (the shortest form that reads back to the same double) every row binds alike.
  if (column.decimal && typeof value === 'number') return String(value);
  return value;
}

/** The transaction's own connection (the mariadb connector's): statements go out in call order. */
export interface TxConnection {
  query<T = unknown>(sql: string, values?: unknown[]): Promise<T>;
  batch(sql: string, values: unknown[][]): Promise<unknown>;
}

type StatementObserver = (sql: string, values: unknown[] | undefined) => void;
let observer: StatementObserver | null = null;

/**
 * Lets a test see every statement sent straight on a transaction's connection (Sequelize's own
 * logging does not); returns the function that stops it.
 */
export function observeStatements(fn: StatementObserver): () => void {
  observer = fn;
  return () => {
    observer = null;
  };
}

interface MariadbConnection {
  query<T>(options: { sql: string; typeCast?: undefined; dateStrings?: boolean }, values?: unknown[]): Promise<T>;
  batch(sql: string, values: unknown[][]): Promise<unknown>;
}

// Sequelize gives its connections a type-casting callback (for its own DATE and DATEONLY parsing),
// and the connector then sends every column of every row through it, dates through a time-zone
// library. Statements sent straight on the connection turn it off and take date-times as text:
// read them with `utcDate` (the connections run in UTC).
const FAST_READ = { typeCast: undefined, dateStrings: true } as const;

/** A DATETIME's text as the app's UTC connections return it ("2026-08-01 10:00:00.000"), as a Date. */
export function utcDate(text: string): Date {
  return new Date(`${text.replace(' ', 'T')}Z`);
}

/** A mariadb connection as the app sends statements on it: reads fast (FAST_READ), seen by a test's observer. */
function wrap(connection: MariadbConnection): TxConnection {
  const seen = observer;
  return {
    query: (sql, values) => {
      seen?.(sql, values);
      return connection.query({ sql, ...FAST_READ }, values);
    },
    batch: (sql, values) => {
      seen?.(sql, values[0]);
      return connection.batch(sql, values);
    },
  };
}

/**
 * The connection a transaction runs on (only mariadb connections carry `batch`). Its reads return
 * date-times as text (see FAST_READ): a caller that reads one converts it with `utcDate`.
 */
export function txConnection(transaction: Transaction): TxConnection {
  const connection = (transaction as unknown as { connection?: MariadbConnection }).connection;
  if (!connection || typeof connection.batch !== 'function') throw new Error('this needs a transaction on a mariadb connection');
  return wrap(connection);
}

/**
 * Runs `fn` with one pool connection held for it, outside any transaction: reads that go out
 * together on it (pipelined), without the two statements a transaction adds. The writer's by
 * default; `writer: false` lets the read routing choose (a replica, unless the person just wrote).
 */
export async function withConnection<T>(sequelize: Sequelize, fn: (connection: TxConnection) => Promise<T>, { writer = true } = {}): Promise<T> {
  // The pool routes by the query type Sequelize itself passes ('SELECT'), whatever its typings say.
  const connection = (await sequelize.connectionManager.getConnection({ type: 'SELECT' as never, useMaster: writer })) as unknown as MariadbConnection;
  try {
    return await fn(wrap(connection));
  } finally {
    sequelize.connectionManager.releaseConnection(connection as never);
  }
}

export const quote = (name: string) => `\`${name.replace(/`/g, '``')}\``;

/**
 * Inserts plain rows (attribute names as keys) into the model's table in one bulk statement;
 * with `updateOnDuplicate` (attribute names), an existing primary key has those columns updated.
 * Timestamps are the caller's: nothing here fills them in.
 */
export async function batchInsert(
  model: ModelStatic<Model>,
  rows: Record<string, unknown>[],
  transaction: Transaction,
  updateOnDuplicate: string[] = [],
): Promise<void> {
  if (rows.length === 0) return;
  const columns = columnsOf(model).filter((c) => rows.some((r) => r[c.attribute] !== undefined));
  const updates = columns.filter((c) => updateOnDuplicate.includes(c.attribute));
  // A computed column's SQL, from the first row (checked against every row below).
  const computed = columns.map((c) => (rows[0]?.[c.attribute] instanceof Computed ? (rows[0][c.attribute] as Computed).sql : null));
  const sql =
    `INSERT INTO ${quote(model.getTableName() as string)} (${columns.map((c) => quote(c.field)).join(', ')}) VALUES (${computed.map((c) => c ?? '?').join(', ')})` +
    (updates.length ? ` ON DUPLICATE KEY UPDATE ${updates.map((c) => `${quote(c.field)} = VALUES(${quote(c.field)})`).join(', ')}` : '');
  await txConnection(transaction).batch(
    sql,
    // A plain loop per row: a push writes hundreds of rows of a dozen cells each.
    rows.map((r) => {
      const cells: unknown[] = [];
      columns.forEach((c, i) => {
        const value = r[c.attribute];
        if (computed[i] === null) cells.push(cell(c, value));
        else if (value instanceof Computed && value.sql === computed[i]) cells.push(...value.values);
        else throw new Error(`${c.attribute}: every row must compute it alike`);
      });
      return cells;
    }),
  );
}
