import type { Sqlite } from '../db/database.js';

export interface RanStatement {
  sql: string;
  params: unknown[];
}

/**
 * Every statement prepared and run on the connection while `act` runs, with its parameters: what the
 * server really asks SQLite, for `EXPLAIN QUERY PLAN`.
 */
export async function statementsDuring(sqlite: Sqlite, act: () => Promise<unknown>): Promise<RanStatement[]> {
  const { connection } = sqlite;
  const prepare = connection.prepare.bind(connection);
  const ran: RanStatement[] = [];
  connection.prepare = ((source: string) => {
    const statement = prepare(source);
    for (const method of ['all', 'get', 'run', 'iterate'] as const) {
      const original = (statement[method] as (...params: unknown[]) => unknown).bind(statement);
      Object.defineProperty(statement, method, {
        value: (...params: unknown[]) => {
          ran.push({ sql: source, params });
          return original(...params);
        },
      });
    }
    return statement;
  }) as typeof connection.prepare;
  try {
    await act();
  } finally {
    connection.prepare = prepare;
  }
  return ran;
}

/** The plan SQLite makes for a statement with those parameters, one line per step. */
export function queryPlan(sqlite: Sqlite, { sql, params }: RanStatement): string[] {
  return (sqlite.connection.prepare(`EXPLAIN QUERY PLAN ${sql}`).all(...params) as { detail: string }[]).map(
    (step) => step.detail,
  );
}
