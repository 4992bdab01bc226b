/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-sqlite-schema.c: the library schema as a list of migration steps.
 *
 * Step n takes a file from PRAGMA user_version n to n + 1, inside the
 * caller's transaction.  A new library runs every step from 0, so the
 * migration path is the one path and is exercised by every test. */
#define G_LOG_DOMAIN "lamina-store"

#include "lamina-sqlite-private.h"

/* Version 1: materials, constructions with their revisions, tags. */
static const char schema_v1[] =
  "CREATE TABLE meta ("
  "  key TEXT PRIMARY KEY,"
  "  value TEXT"
  ");"
  "CREATE TABLE material ("
  "  id TEXT PRIMARY KEY,"
  "  name TEXT NOT NULL,"
  "  category TEXT NOT NULL,"
  "  conductivity REAL NOT NULL CHECK (conductivity > 0),"
  "  density REAL,"
  "  specific_heat REAL,"
  "  vapour_resistance_factor REAL,"
  "  emissivity REAL,"
  "  source TEXT,"
  "  notes TEXT,"
  "  fingerprint TEXT NOT NULL,"
  "  modified_at TEXT NOT NULL"
  ");"
  /* One row per construction: its latest revision's figures, kept for
   * listing, filtering and sorting without reading the bodies. */
  "CREATE TABLE construction ("
  "  num INTEGER PRIMARY KEY,"
  "  id TEXT NOT NULL UNIQUE,"
  "  head INTEGER NOT NULL,"
  "  code TEXT,"
  "  name TEXT NOT NULL,"
  "  element TEXT NOT NULL,"
  "  status TEXT NOT NULL,"
  "  u REAL,"
  "  u_corrected REAL,"
  "  target_u REAL,"
  "  thickness REAL,"
  "  flags INTEGER NOT NULL DEFAULT 0,"
  "  modified_at TEXT NOT NULL"
  ");"
  "CREATE TABLE revision ("
  "  construction_id TEXT NOT NULL REFERENCES construction (id),"
  "  revision INTEGER NOT NULL CHECK (revision > 0),"
  "  status TEXT NOT NULL CHECK (status IN ('draft', 'checked', 'approved')),"
  "  body TEXT NOT NULL,"
  "  u REAL,"
  "  u_corrected REAL,"
  "  r_total REAL,"
  "  thickness REAL,"
  "  calc_error TEXT,"
  "  modified_by TEXT NOT NULL,"
  "  modified_at TEXT NOT NULL,"
  "  checked_by TEXT,"
  "  checked_at TEXT,"
  "  approved_by TEXT,"
  "  approved_at TEXT,"
  "  comment TEXT,"
  "  PRIMARY KEY (construction_id, revision)"
  ") WITHOUT ROWID;"
  /* The material data each revision was calculated with. */
  "CREATE TABLE revision_material ("
  "  construction_id TEXT NOT NULL,"
  "  revision INTEGER NOT NULL,"
  "  material_id TEXT NOT NULL,"
  "  fingerprint TEXT NOT NULL,"
  "  PRIMARY KEY (construction_id, revision, material_id),"
  "  FOREIGN KEY (construction_id, revision) REFERENCES revision (construction_id, revision)"
  ") WITHOUT ROWID;"
  "CREATE INDEX revision_material_by_material ON revision_material (material_id);"
  "CREATE TABLE construction_tag ("
  "  construction_id TEXT NOT NULL REFERENCES construction (id),"
  "  tag TEXT NOT NULL,"
  "  PRIMARY KEY (construction_id, tag)"
  ") WITHOUT ROWID;"
  "CREATE INDEX construction_tag_by_tag ON construction_tag (tag);"
  "CREATE INDEX construction_by_code ON construction (code COLLATE NOCASE);";

/* Version 2: soft deletion (undo in the window), the "material data
 * changed since review" flag, full-text search, partial indexes for
 * every sort key, and triggers that make stored revisions immutable. */
static const char schema_v2[] =
  "ALTER TABLE construction ADD COLUMN deleted_at TEXT;"
  "ALTER TABLE construction ADD COLUMN material_changed INTEGER NOT NULL DEFAULT 0;"
  "DROP INDEX construction_by_code;"
  "CREATE INDEX construction_by_code ON construction (code COLLATE NOCASE, id)"
  "  WHERE deleted_at IS NULL;"
  "CREATE INDEX construction_by_name ON construction (name COLLATE NOCASE, id)"
  "  WHERE deleted_at IS NULL;"
  "CREATE INDEX construction_by_u ON construction (u_corrected, id)"
  "  WHERE deleted_at IS NULL;"
  "CREATE INDEX construction_by_thickness ON construction (thickness, id)"
  "  WHERE deleted_at IS NULL;"
  "CREATE INDEX construction_by_modified ON construction (modified_at, id)"
  "  WHERE deleted_at IS NULL;"
  "CREATE INDEX construction_by_element ON construction (element, code COLLATE NOCASE)"
  "  WHERE deleted_at IS NULL;"
  "CREATE VIRTUAL TABLE construction_fts USING fts5 ("
  "  code, name, description, tags, materials,"
  "  tokenize = 'unicode61 remove_diacritics 2',"
  "  prefix = '1 2 3'"
  ");"
  "INSERT INTO construction_fts (rowid, code, name, description, tags, materials)"
  "  SELECT c.num, c.code, c.name,"
  "         json_extract (r.body, '$.description'),"
  "         (SELECT group_concat (t.tag, ' ') FROM construction_tag t"
  "           WHERE t.construction_id = c.id),"
  "         (SELECT group_concat (n, ' ') FROM ("
  "            SELECT json_extract (l.value, '$.material.name') AS n"
  "              FROM json_each (r.body, '$.layers') l"
  "            UNION ALL"
  "            SELECT json_extract (p.value, '$.material.name')"
  "              FROM json_each (r.body, '$.layers') l,"
  "                   json_each (l.value, '$.parts') p))"
  "    FROM construction c"
  "    JOIN revision r ON r.construction_id = c.id AND r.revision = c.head;"
  "CREATE TRIGGER revision_content_immutable"
  "  BEFORE UPDATE OF construction_id, revision, body, u, u_corrected, r_total,"
  "                   thickness, calc_error, modified_by, modified_at"
  "  ON revision"
  "  BEGIN SELECT RAISE (ABORT, 'a stored revision never changes'); END;"
  "CREATE TRIGGER revision_approved_immutable"
  "  BEFORE UPDATE ON revision WHEN OLD.status = 'approved'"
  "  BEGIN SELECT RAISE (ABORT, 'an approved revision is immutable'); END;"
  "CREATE TRIGGER revision_approved_kept"
  "  BEFORE DELETE ON revision WHEN OLD.status = 'approved'"
  "  BEGIN SELECT RAISE (ABORT, 'an approved revision is immutable'); END;";

/* Version 3: the few deleted constructions indexed on their own, so that
 * a text search can be counted on the full-text index alone, minus them,
 * instead of joining every match back to its row. */
static const char schema_v3[] =
  "CREATE INDEX construction_deleted ON construction (num)"
  "  WHERE deleted_at IS NOT NULL;";

/* Version 4: target sets and jobs.  A body is a catalogue document with
 * the one record; job_entry mirrors each schedule so that the jobs using
 * a construction are found by index. */
static const char schema_v4[] =
  "CREATE TABLE target_set ("
  "  id TEXT PRIMARY KEY,"
  "  name TEXT NOT NULL,"
  "  body TEXT NOT NULL,"
  "  modified_at TEXT"
  ");"
  "CREATE TABLE job ("
  "  id TEXT PRIMARY KEY,"
  "  name TEXT NOT NULL,"
  "  number TEXT,"
  "  status TEXT NOT NULL CHECK (status IN ('design', 'submitted', 'built')),"
  "  body TEXT NOT NULL,"
  "  modified_at TEXT"
  ");"
  "CREATE TABLE job_entry ("
  "  job_id TEXT NOT NULL REFERENCES job (id),"
  "  n INTEGER NOT NULL CHECK (n > 0),"
  "  construction_id TEXT NOT NULL,"
  "  revision INTEGER NOT NULL CHECK (revision > 0),"
  "  use TEXT NOT NULL,"
  "  PRIMARY KEY (job_id, n)"
  ") WITHOUT ROWID;"
  "CREATE INDEX job_entry_by_construction ON job_entry (construction_id);";

/* Version 5: the 2-D checks (EN ISO 10211), one per revision that was
 * checked.  Kept beside the revision, whose content never changes. */
static const char schema_v5[] =
  "CREATE TABLE field_check ("
  "  construction_id TEXT NOT NULL,"
  "  revision INTEGER NOT NULL CHECK (revision > 0),"
  "  body TEXT NOT NULL,"
  "  computed_at TEXT NOT NULL,"
  "  PRIMARY KEY (construction_id, revision),"
  "  FOREIGN KEY (construction_id, revision) REFERENCES revision (construction_id, revision)"
  ") WITHOUT ROWID;";

/* Version 6: climates (EN ISO 13788), the external climate a
 * construction's moisture check refers to by id; the months are a JSON
 * body, the fingerprint flags constructions checked with other data. */
static const char schema_v6[] =
  "CREATE TABLE climate ("
  "  id TEXT PRIMARY KEY,"
  "  name TEXT NOT NULL,"
  "  source TEXT,"
  "  months TEXT NOT NULL,"
  "  fingerprint TEXT NOT NULL,"
  "  modified_at TEXT NOT NULL"
  ");";

/* Version 7: the thicknesses a material is sold in ("50 100 150", mm),
 * to which a thickness solved for a target U is rounded up. */
static const char schema_v7[] =
  "ALTER TABLE material ADD COLUMN stock_thicknesses TEXT;";

/* Version 8: every review act kept as a record (a second check adds one,
 * an approval names the policy it was made under and any reason given to
 * approve beyond the method's scope, a withdrawal its reason).  The
 * records never change.  An approval can be withdrawn: the one change an
 * approved revision allows is back to "checked" without approver (its
 * content stays immutable through revision_content_immutable).  Earlier
 * checks and approvals become records of their own. */
static const char schema_v8[] =
  "CREATE TABLE review_event ("
  "  num INTEGER PRIMARY KEY,"
  "  construction_id TEXT NOT NULL,"
  "  revision INTEGER NOT NULL CHECK (revision > 0),"
  "  act TEXT NOT NULL CHECK (act IN ('checked', 'approved', 'withdrawn')),"
  "  person TEXT NOT NULL,"
  "  at TEXT NOT NULL,"
  "  date TEXT,"
  "  policy TEXT,"
  "  reason TEXT,"
  "  FOREIGN KEY (construction_id, revision) REFERENCES revision (construction_id, revision)"
  ");"
  "CREATE INDEX review_event_by_revision ON review_event (construction_id, revision);"
  "CREATE TRIGGER review_event_immutable BEFORE UPDATE ON review_event"
  "  BEGIN SELECT RAISE (ABORT, 'a review record never changes'); END;"
  "CREATE TRIGGER review_event_kept BEFORE DELETE ON review_event"
  "  BEGIN SELECT RAISE (ABORT, 'a review record never changes'); END;"
  "INSERT INTO review_event (construction_id, revision, act, person, at)"
  "  SELECT construction_id, revision, 'checked', checked_by, coalesce (checked_at, modified_at)"
  "    FROM revision WHERE checked_by IS NOT NULL ORDER BY construction_id, revision;"
  "INSERT INTO review_event (construction_id, revision, act, person, at, date)"
  "  SELECT construction_id, revision, 'approved', approved_by, approved_at, approved_at"
  "    FROM revision WHERE approved_by IS NOT NULL ORDER BY construction_id, revision;"
  "DROP TRIGGER revision_approved_immutable;"
  "CREATE TRIGGER revision_approved_immutable"
  "  BEFORE UPDATE ON revision WHEN OLD.status = 'approved'"
  "    AND NOT (NEW.status = 'checked' AND NEW.approved_by IS NULL AND NEW.approved_at IS NULL"
  "             AND NEW.checked_by IS OLD.checked_by AND NEW.checked_at IS OLD.checked_at"
  "             AND NEW.comment IS OLD.comment)"
  "  BEGIN SELECT RAISE (ABORT, 'an approved revision is immutable'); END;";

static const char *const steps[] = {
  schema_v1,
  schema_v2,
  schema_v3,
  schema_v4,
  schema_v5,
  schema_v6,
  schema_v7,
  schema_v8,
};

G_STATIC_ASSERT (G_N_ELEMENTS (steps) == LAMINA_LIBRARY_SCHEMA_VERSION);

gboolean
lamina_sqlite_migrate (LaminaSqlite  *self,
                       int            from,
                       int            to,
                       GError       **error)
{
  g_return_val_if_fail (from >= 0 && to <= (int) G_N_ELEMENTS (steps), FALSE);

  for (int v = from; v < to; v++)
    {
      g_autofree char *set_version = NULL;

      if (!lamina_sqlite_exec (self, steps[v], error))
        return FALSE;
      set_version = g_strdup_printf ("PRAGMA user_version = %d;", v + 1);
      if (!lamina_sqlite_exec (self, set_version, error))
        return FALSE;
    }
  /* Version 2 introduced the flag: compute it for what is there. */
  if (from < 2 && to >= 2 && from > 0)
    return lamina_sqlite_refresh_material_flags (self, NULL, error);
  return TRUE;
}
