/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-pg-roles.c: "lamina-cli server-init": the roles of an office
 * library on a PostgreSQL server, enforced by the server itself.
 *
 *  - lamina_author edits drafts: reads everything, adds revisions (always
 *    drafts, recorded under the server's name of the person), keeps
 *    materials, climates, target sets and jobs;
 *  - lamina_checker is an author who may also check, lamina_approver a
 *    checker who may also approve and withdraw, through
 *    lamina_review_act, which then runs
 *    as the library's owner (SECURITY DEFINER), records session_user and
 *    applies the library's review policy on the server.
 *  Nobody but the owner may change a revision's review columns, write a
 *  review record, store a reviewed revision or change the settings (the
 *  review policy among them): plain SQL from psql is refused as well. */
#define G_LOG_DOMAIN "lamina-store"

#include "lamina-pg-private.h"

#define REVIEW_ACT "lamina_review_act (text, integer, text, text, text, text, text, text)"

static const char roles_sql[] =
  "DO $$ BEGIN"
  "  IF NOT EXISTS (SELECT FROM pg_roles WHERE rolname = 'lamina_author') THEN"
  "    CREATE ROLE lamina_author NOLOGIN; END IF;"
  "  IF NOT EXISTS (SELECT FROM pg_roles WHERE rolname = 'lamina_checker') THEN"
  "    CREATE ROLE lamina_checker NOLOGIN; END IF;"
  "  IF NOT EXISTS (SELECT FROM pg_roles WHERE rolname = 'lamina_approver') THEN"
  "    CREATE ROLE lamina_approver NOLOGIN; END IF;"
  "END $$;"
  "GRANT lamina_author TO lamina_checker;"
  "GRANT lamina_checker TO lamina_approver;"
  "REVOKE ALL ON meta, material, construction, revision, revision_material, construction_tag,"
  "  target_set, job, job_entry, field_check, climate, review_event FROM PUBLIC;"
  "GRANT SELECT ON meta, material, construction, revision, revision_material, construction_tag,"
  "  target_set, job, job_entry, field_check, climate, review_event TO lamina_author;"
  "GRANT INSERT, UPDATE ON material, climate, field_check, construction TO lamina_author;"
  "GRANT INSERT ON revision, revision_material TO lamina_author;"
  /* A draft edited in place is removed and stored again (the guard keeps
   * approved revisions; a reviewed one is held by its review records). */
  "GRANT DELETE ON revision, revision_material, field_check TO lamina_author;"
  "GRANT INSERT, DELETE ON construction_tag TO lamina_author;"
  "GRANT INSERT, UPDATE, DELETE ON target_set, job, job_entry TO lamina_author;"
  "GRANT USAGE ON SEQUENCE construction_num_seq TO lamina_author;"
  "REVOKE ALL ON FUNCTION " REVIEW_ACT " FROM PUBLIC;"
  "GRANT EXECUTE ON FUNCTION " REVIEW_ACT " TO lamina_author;"
  "ALTER FUNCTION " REVIEW_ACT " SECURITY DEFINER;"
  /* As its owner, it must find only the library's tables: no temporary
   * table of the caller's in front of them. */
  "DO $$ BEGIN"
  "  EXECUTE format ('ALTER FUNCTION " REVIEW_ACT " SET search_path = %I, pg_temp',"
  "                  current_schema ());"
  "END $$;"
  /* Whoever is not the owner stores drafts only, under their own name;
   * the list's status follows the revision's, whatever an UPDATE says. */
  "CREATE OR REPLACE FUNCTION lamina_author_guard () RETURNS trigger LANGUAGE plpgsql AS $$"
  "BEGIN"
  "  IF current_user = (SELECT pg_get_userbyid (relowner) FROM pg_class"
  "                      WHERE oid = TG_RELID) THEN"
  "    RETURN NEW;"
  "  END IF;"
  "  IF TG_TABLE_NAME = 'revision' THEN"
  "    IF NEW.status <> 'draft' OR NEW.checked_by IS NOT NULL OR NEW.approved_by IS NOT NULL THEN"
  "      RAISE EXCEPTION '%: only drafts can be stored; checking and approving go through the "
  "review (lamina-cli check, approve), which the server records under your name', session_user"
  "        USING ERRCODE = 'LM002';"
  "    END IF;"
  "    NEW.modified_by := session_user;"
  "  ELSE"
  "    NEW.status := coalesce ((SELECT r.status FROM revision r"
  "                              WHERE r.construction_id = NEW.id AND r.revision = NEW.head),"
  "                            'draft');"
  "  END IF;"
  "  RETURN NEW;"
  "END $$;"
  "DROP TRIGGER IF EXISTS revision_author_guard ON revision;"
  "CREATE TRIGGER revision_author_guard BEFORE INSERT ON revision"
  "  FOR EACH ROW EXECUTE FUNCTION lamina_author_guard ();"
  "DROP TRIGGER IF EXISTS construction_author_guard ON construction;"
  "CREATE TRIGGER construction_author_guard BEFORE INSERT OR UPDATE ON construction"
  "  FOR EACH ROW EXECUTE FUNCTION lamina_author_guard ();"
  "INSERT INTO meta (key, value) VALUES ('server_roles', 'on')"
  "  ON CONFLICT (key) DO UPDATE SET value = 'on';";

static gboolean
server_init_txn (LaminaPg  *self,
                 gpointer   data,
                 GError   **error)
{
  return lamina_pg_exec (self, roles_sql, error);
}

gboolean
lamina_pg_server_init (LaminaBackend  *backend,
                       GError        **error)
{
  LaminaPg *self = (LaminaPg *) backend;

  if (!lamina_pg_transaction (self, server_init_txn, NULL, error))
    return FALSE;
  self->roles = TRUE;
  return TRUE;
}
