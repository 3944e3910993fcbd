// A fingerprint of a database's schema from pg_catalog, for tests that must prove a schema is
// unchanged (migrations down and up again, a failed migration, a restore). One entry per object,
// keyed "kind name", so a difference reads as the objects that changed. Covers the public schema
// (tables with their columns in order, types, nullability, defaults, generated and identity
// columns; indexes, constraints, triggers, row-level policies, sequences, views, functions, types)
// and the database's extensions. Kysely's own bookkeeping tables are left out; objects that belong
// to an extension are listed under the extension, not one by one.
import { sql, type Kysely } from "kysely";

export type SchemaFingerprint = Record<string, string>;

type Row = { key: string; def: string };

// Objects of the public schema that are not members of an extension.
const notInExtension = (oidColumn: string, catalog: string) =>
  `not exists (select 1 from pg_depend d where d.classid = '${catalog}'::regclass and d.objid = ${oidColumn} and d.deptype = 'e')`;

const QUERIES: string[] = [
  // Tables, views, sequences… with their kind and row-level security flags.
  `select 'relation ' || c.relname as key,
          c.relkind::text || ' rls=' || c.relrowsecurity || ' persistence=' || c.relpersistence::text as def
     from pg_class c join pg_namespace n on n.oid = c.relnamespace
    where n.nspname = 'public' and c.relkind in ('r', 'p', 'v', 'm', 'f', 'S')
      and c.relname not like 'kysely\\_%' and ${notInExtension("c.oid", "pg_class")}`,
  // Columns: position among the live columns (dropped ones leave gaps in attnum), type, null, default.
  `select 'column ' || c.relname || '.' || a.attname as key,
          concat_ws(' ',
            '#' || row_number() over (partition by c.oid order by a.attnum),
            format_type(a.atttypid, a.atttypmod),
            case when a.attnotnull then 'not null' else 'null' end,
            'default=' || coalesce(pg_get_expr(ad.adbin, ad.adrelid), '-'),
            'generated=' || coalesce(nullif(a.attgenerated::text, ''), '-'),
            'identity=' || coalesce(nullif(a.attidentity::text, ''), '-'),
            'collation=' || coalesce(nullif(co.collname, 'default'), '-')) as def
     from pg_attribute a
     join pg_class c on c.oid = a.attrelid
     join pg_namespace n on n.oid = c.relnamespace
     left join pg_attrdef ad on ad.adrelid = a.attrelid and ad.adnum = a.attnum
     left join pg_collation co on co.oid = a.attcollation
    where n.nspname = 'public' and c.relkind in ('r', 'p', 'v', 'm', 'f')
      and a.attnum > 0 and not a.attisdropped
      and c.relname not like 'kysely\\_%' and ${notInExtension("c.oid", "pg_class")}`,
  `select 'index ' || t.relname || '.' || i.relname as key, pg_get_indexdef(i.oid) as def
     from pg_index x
     join pg_class i on i.oid = x.indexrelid
     join pg_class t on t.oid = x.indrelid
     join pg_namespace n on n.oid = t.relnamespace
    where n.nspname = 'public' and t.relname not like 'kysely\\_%'`,
  `select 'constraint ' || coalesce(t.relname, ty.typname) || '.' || k.conname as key,
          k.contype::text || ' ' || pg_get_constraintdef(k.oid) ||
            case when k.condeferrable then ' deferrable' else '' end as def
     from pg_constraint k
     join pg_namespace n on n.oid = k.connamespace
     left join pg_class t on t.oid = k.conrelid
     left join pg_type ty on ty.oid = k.contypid
    where n.nspname = 'public' and coalesce(t.relname, '') not like 'kysely\\_%'`,
  `select 'trigger ' || c.relname || '.' || tg.tgname as key,
          pg_get_triggerdef(tg.oid) || ' enabled=' || tg.tgenabled::text as def
     from pg_trigger tg join pg_class c on c.oid = tg.tgrelid join pg_namespace n on n.oid = c.relnamespace
    where n.nspname = 'public' and not tg.tgisinternal`,
  `select 'policy ' || p.tablename || '.' || p.policyname as key,
          concat_ws(' ', p.permissive, p.cmd, array_to_string(p.roles, ','), p.qual, p.with_check) as def
     from pg_policies p where p.schemaname = 'public'`,
  `select 'sequence ' || s.sequencename as key,
          concat_ws(' ', s.data_type::text, s.start_value, s.min_value, s.max_value, s.increment_by, s.cycle,
            'owned_by=' || coalesce((select c.relname || '.' || a.attname from pg_depend d
               join pg_class c on c.oid = d.refobjid
               join pg_attribute a on a.attrelid = d.refobjid and a.attnum = d.refobjsubid
              where d.classid = 'pg_class'::regclass and d.objid = (quote_ident(s.schemaname) || '.' || quote_ident(s.sequencename))::regclass
                and d.deptype in ('a', 'i') limit 1), '-')) as def
     from pg_sequences s where s.schemaname = 'public'`,
  `select 'view ' || c.relname as key, pg_get_viewdef(c.oid) as def
     from pg_class c join pg_namespace n on n.oid = c.relnamespace
    where n.nspname = 'public' and c.relkind in ('v', 'm')`,
  `select 'function ' || p.proname || '(' || pg_get_function_identity_arguments(p.oid) || ')' as key,
          case when p.prokind in ('f', 'p') then md5(pg_get_functiondef(p.oid)) else p.prokind::text end as def
     from pg_proc p join pg_namespace n on n.oid = p.pronamespace
    where n.nspname = 'public' and ${notInExtension("p.oid", "pg_proc")}`,
  `select 'type ' || t.typname as key,
          t.typtype::text || ' ' || coalesce((select string_agg(e.enumlabel, ',' order by e.enumsortorder) from pg_enum e where e.enumtypid = t.oid), '') as def
     from pg_type t join pg_namespace n on n.oid = t.typnamespace
    where n.nspname = 'public' and t.typtype in ('e', 'd', 'r', 'm')
      and ${notInExtension("t.oid", "pg_type")}`,
  `select 'extension ' || e.extname as key, e.extversion || ' schema=' || n.nspname as def
     from pg_extension e join pg_namespace n on n.oid = e.extnamespace`,
];

export async function schemaFingerprint(db: Kysely<unknown>): Promise<SchemaFingerprint> {
  const print: SchemaFingerprint = {};
  for (const query of QUERIES) {
    const { rows } = await sql<Row>`${sql.raw(query)}`.execute(db);
    for (const row of rows) print[row.key] = row.def;
  }
  return Object.fromEntries(Object.entries(print).sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0)));
}

/**
 * The same fingerprint with CHECK expressions written without parentheses. PostgreSQL stores a
 * CHECK as a parsed tree and prints it back with its own parentheses; re-creating it from that text
 * (as a restore does) flattens nested ANDs, so `((a AND b) AND c)` comes back as `(a AND b AND c)`.
 * Compare a restored schema through this; a migration's round trip re-runs the same DDL and is
 * compared as it is.
 */
export function withoutCheckParentheses(print: SchemaFingerprint): SchemaFingerprint {
  return Object.fromEntries(
    Object.entries(print).map(([key, def]) => [
      key,
      key.startsWith("constraint ") && def.startsWith("c CHECK")
        ? def.replace(/[()\s]+/g, " ")
        : def,
    ]),
  );
}

/** The entries that differ, as readable lines ("- key: def" was, "+ key: def" is). */
export function fingerprintDiff(before: SchemaFingerprint, after: SchemaFingerprint): string[] {
  const lines: string[] = [];
  for (const key of new Set([...Object.keys(before), ...Object.keys(after)])) {
    if (before[key] === after[key]) continue;
    if (key in before) lines.push(`- ${key}: ${before[key]}`);
    if (key in after) lines.push(`+ ${key}: ${after[key]}`);
  }
  return lines.sort((a, b) => (a.slice(2) < b.slice(2) ? -1 : 1));
}

/** The tables an object of the fingerprint belongs to (for "which tables did this step touch"). */
export function tablesOf(key: string): string[] {
  const [kind, name = ""] = key.split(" ", 2);
  if (kind === "relation" || kind === "view") return [name];
  if (["column", "index", "constraint", "trigger", "policy"].includes(kind ?? ""))
    return [name.split(".")[0] ?? ""];
  return [];
}
