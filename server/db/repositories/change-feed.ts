// The pull's read of every synced table in one statement. One statement sees one snapshot, so a
// page is consistent across tables without a transaction, and it costs one round trip instead of
// one per table. The SQL text is built once from the drizzle schema and sent as a named prepared
// statement: PostgreSQL plans it once per connection and the server builds no query per request.
// Each row travels as to_jsonb and is mapped back to drizzle's row shape with the columns' own
// driver mappings, so presenters receive exactly what a drizzle select would have given them.
import { getTableColumns, getTableName, type Column } from "drizzle-orm";
import type { PgColumn, PgTable } from "drizzle-orm/pg-core";
import type { Db } from "../client";
import { memberships, syncClients, users } from "../schema";

/** One synced table: what the pull calls its rows, and the user whose name rides along. */
export interface FeedTable {
  readonly entity: string;
  readonly table: PgTable;
  /** The column naming a user, and the key the user's name is given under (e.g. recordedByName). */
  readonly author?: { readonly by: PgColumn; readonly as: string };
}

export interface FeedRow {
  readonly entity: string;
  readonly seq: number;
  readonly row: Record<string, unknown>;
}

export interface FeedPage {
  /** Up to `limit` rows in change order, across every table. */
  readonly rows: FeedRow[];
  /** The device's owner and last applied mutation, read in the same snapshot. */
  readonly client: { userId: string; lastMutationId: number } | null;
  /** Whether the reader is a member of the campaign (the rows must not be used otherwise). */
  readonly member: boolean;
}

type Mapper = (json: Record<string, unknown>) => Record<string, unknown>;

const q = (name: string) => `"${name.replaceAll('"', '""')}"`;

function mapperOf(source: FeedTable): Mapper {
  const columns = Object.entries(getTableColumns(source.table)).map(
    ([key, column]: [string, Column]) => ({
      key,
      name: column.name,
      // jsonb arrives parsed; a second parse would turn a stored string such as "12" into 12.
      map: column.columnType === "PgJsonb" || column.columnType === "PgJson" ? undefined : column,
    }),
  );
  const authorKey = source.author?.as;
  return (json) => {
    const row: Record<string, unknown> = {};
    for (const { key, name, map } of columns) {
      const value = json[name] ?? null;
      row[key] = value === null || map === undefined ? value : map.mapFromDriverValue(value);
    }
    if (authorKey !== undefined) row[authorKey] = json["$author"] ?? null;
    return row;
  };
}

function branch(source: FeedTable): string {
  const table = q(getTableName(source.table));
  const seq = `t.${q("change_seq")}`;
  const author = source.author;
  const row = author
    ? `to_jsonb(t) || jsonb_build_object('$author', u.${q(users.name.name)})`
    : "to_jsonb(t)";
  const join = author
    ? ` left join ${q(getTableName(users))} u on u.${q(users.id.name)} = t.${q(author.by.name)}`
    : "";
  return (
    `(select '${source.entity}' as entity, ${seq} as seq, ${row} as row from ${table} t${join}` +
    ` where t.${q("campaign_id")} = $1 and ${seq} > $2 order by ${seq} limit $3)`
  );
}

/** Builds the statement for these tables once; read() runs it for one page. */
export function changeFeed(sources: readonly FeedTable[]) {
  const mappers = new Map(sources.map((s) => [s.entity, mapperOf(s)]));
  const clients = q(getTableName(syncClients));
  const members = q(getTableName(memberships));
  // $4 may be null (no device named): the device branch then finds nothing. The membership of
  // reader $5 comes in the same statement, saving the round trip of a check before it.
  const text =
    `(select entity, seq::float8 as seq, row from (${sources.map(branch).join(" union all ")})` +
    ` page order by seq limit $3)` +
    ` union all (select '$client', 0, jsonb_build_object('userId', ${q(syncClients.userId.name)},` +
    ` 'lastMutationId', ${q(syncClients.lastMutationId.name)}) from ${clients}` +
    ` where ${q(syncClients.id.name)} = $4::uuid)` +
    ` union all (select '$member', 0, '{}'::jsonb from ${members}` +
    ` where ${q(memberships.campaignId.name)} = $1 and ${q(memberships.userId.name)} = $5::uuid)`;
  // The name changes with the text, so a changed schema never runs a stale prepared statement.
  const name = `change-feed-${hash(text)}`;

  return async function read(
    db: Db,
    campaignId: string,
    cursor: number,
    limit: number,
    clientId: string | null,
    readerId: string,
  ): Promise<FeedPage> {
    const result = await db.$client.query<{
      entity: string;
      seq: number;
      row: Record<string, unknown>;
    }>({ name, text, values: [campaignId, cursor, limit, clientId, readerId] });
    const rows: FeedRow[] = [];
    let client: FeedPage["client"] = null;
    let member = false;
    for (const r of result.rows) {
      if (r.entity === "$member") {
        member = true;
        continue;
      }
      if (r.entity === "$client") {
        client = r.row as { userId: string; lastMutationId: number };
        continue;
      }
      const map = mappers.get(r.entity);
      if (!map) throw new Error(`the change feed returned an unknown entity ${r.entity}`);
      rows.push({ entity: r.entity, seq: r.seq, row: map(r.row) });
    }
    return { rows, client, member };
  };
}

/** A short stable digest of the statement text (FNV-1a), for its prepared-statement name. */
function hash(text: string): string {
  let h = 0x811c9dc5;
  for (let i = 0; i < text.length; i++) h = Math.imul(h ^ text.charCodeAt(i), 0x01000193);
  return (h >>> 0).toString(16);
}
