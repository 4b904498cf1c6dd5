// The application's PostgreSQL role: it may read and write the tables, but it neither owns them nor
// passes row-level security, so the policies of drizzle/0009_row_security.sql hold for it.
import pg from "pg";

/** Grants `role` what the application needs; run by the owner after each migration. */
export async function grantAppRole(ownerUrl: string, role: string): Promise<void> {
  const client = new pg.Client({ connectionString: ownerUrl });
  await client.connect();
  try {
    const name = client.escapeIdentifier(role);
    await client.query(`grant usage on schema public to ${name}`);
    await client.query(
      `grant select, insert, update, delete on all tables in schema public to ${name}`,
    );
    await client.query(`grant usage, select, update on all sequences in schema public to ${name}`);
  } finally {
    await client.end();
  }
}

/** Creates (or updates) a login role with no special powers; for the local and test clusters. */
export async function ensureAppRole(adminUrl: string, role: string, password: string) {
  const client = new pg.Client({ connectionString: adminUrl });
  await client.connect();
  try {
    const found = await client.query("select 1 from pg_roles where rolname = $1", [role]);
    const verb = found.rowCount === 0 ? "create" : "alter";
    await client.query(
      `${verb} role ${client.escapeIdentifier(role)} login password ${client.escapeLiteral(password)} nosuperuser nobypassrls nocreatedb nocreaterole`,
    );
  } finally {
    await client.end();
  }
}

/** Why this connection's role must not run the application, or undefined when it may. */
export async function privilegedRoleProblem(pool: pg.Pool): Promise<string | undefined> {
  const { rows } = await pool.query<{
    name: string;
    super: boolean;
    bypass: boolean;
    owns: boolean;
  }>(
    `select current_user as name, r.rolsuper as super, r.rolbypassrls as bypass,
            exists (select 1 from pg_tables t where t.schemaname = 'public' and t.tableowner = current_user) as owns
       from pg_roles r where r.rolname = current_user`,
  );
  const role = rows[0];
  if (!role) return "its role could not be read";
  const powers = [
    role.super && "is a superuser",
    role.bypass && "has BYPASSRLS",
    role.owns && "owns the tables",
  ].filter(Boolean);
  if (powers.length === 0) return undefined;
  return `DATABASE_URL connects as "${role.name}", which ${powers.join(" and ")}. Equipot's row-level security needs a role that does none of these: see README, "PostgreSQL roles".`;
}

/** The same server and database as `url`, as `role`. */
export function urlAs(url: string, role: string, password: string): string {
  const parsed = new URL(url);
  parsed.username = encodeURIComponent(role);
  parsed.password = encodeURIComponent(password);
  return parsed.toString();
}
