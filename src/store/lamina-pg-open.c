/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-pg-open.c: telling a server address from a file path,
 * connecting, recognising, creating and migrating a library on a
 * PostgreSQL server; the backend's table of operations. */
#define G_LOG_DOMAIN "lamina-store"

#include "config.h"

#include "lamina-pg-private.h"

#include <string.h>

/* The advisory lock every creation or migration of a library takes, so
 * that two clients opening a new database at once make one schema. */
#define SCHEMA_LOCK "4c4d4e41"

gboolean
lamina_library_is_server_address (const char *location)
{
  PQconninfoOption *options;
  const char *p;

  if (location == NULL)
    return FALSE;
  if (g_str_has_prefix (location, "postgresql://") || g_str_has_prefix (location, "postgres://"))
    return TRUE;
  /* A libpq "keyword=value …" string: a keyword first, then "=".  A file
   * name such as "a=b.sqlite" is not one libpq accepts. */
  for (p = location; g_ascii_isspace (*p); p++)
    ;
  if (!g_ascii_isalpha (*p))
    return FALSE;
  while (g_ascii_isalnum (*p) || *p == '_')
    p++;
  while (g_ascii_isspace (*p))
    p++;
  if (*p != '=')
    return FALSE;
  options = PQconninfoParse (location, NULL);
  if (options == NULL)
    return FALSE;
  PQconninfoFree (options);
  return TRUE;
}

/* The address for messages: what was given, unless it holds a password
 * (which belongs in the password file, never in a message or log). */
static char *
dup_label (const char *conninfo)
{
  PQconninfoOption *options = PQconninfoParse (conninfo, NULL);
  g_autoptr(GString) label = NULL;
  gboolean has_password = FALSE;

  if (options == NULL)
    return g_strdup (conninfo);
  for (PQconninfoOption *o = options; o->keyword != NULL; o++)
    if (strcmp (o->keyword, "password") == 0 && o->val != NULL)
      has_password = TRUE;
  if (!has_password)
    {
      PQconninfoFree (options);
      return g_strdup (conninfo);
    }
  label = g_string_new (NULL);
  for (PQconninfoOption *o = options; o->keyword != NULL; o++)
    if (o->val != NULL && *o->val && strcmp (o->keyword, "password") != 0)
      g_string_append_printf (label, "%s%s=%s", label->len ? " " : "", o->keyword, o->val);
  PQconninfoFree (options);
  return g_string_free (g_steal_pointer (&label), FALSE);
}

char *
lamina_pg_dup_label (const char *conninfo)
{
  return dup_label (conninfo);
}

char *
lamina_pg_dup_backup_stem (const char *conninfo)
{
  PQconninfoOption *options = PQconninfoParse (conninfo, NULL);
  g_autofree char *name = NULL;

  for (PQconninfoOption *o = options; o != NULL && o->keyword != NULL; o++)
    if (strcmp (o->keyword, "dbname") == 0 && o->val != NULL && *o->val)
      name = g_strdup (o->val);
    else if (strcmp (o->keyword, "service") == 0 && o->val != NULL && *o->val && name == NULL)
      name = g_strdup (o->val);
  if (options != NULL)
    PQconninfoFree (options);
  if (name == NULL)
    name = g_strdup ("server");
  /* A file name: letters, digits, '-', '_' and '.' only. */
  for (char *p = name; *p; p++)
    if (!g_ascii_isalnum (*p) && *p != '-' && *p != '_' && *p != '.')
      *p = '_';
  return g_steal_pointer (&name);
}

static void
lamina_pg_close (LaminaBackend *backend)
{
  LaminaPg *self = (LaminaPg *) backend;

  if (self->conn != NULL)
    PQfinish (self->conn);
  if (self->watch != NULL)
    PQfinish (self->watch);
  if (self->password != NULL)
    memset (self->password, 0, strlen (self->password));
  g_free (self->password);
  g_free (self->announced_holder);
  g_clear_pointer (&self->pending, g_ptr_array_unref);
  g_clear_pointer (&self->statements, g_hash_table_unref);
  g_free (self->label);
  g_free (self->parent.path);
  g_free (self->parent.backup_path);
  g_free (self->parent.read_only_reason);
  g_free (self);
}

/* A colleague's commit arrives as a notification; our own are ignored
 * (the front end emits "changed" for them itself). */
static gboolean
lamina_pg_check_for_changes (LaminaBackend *backend)
{
  LaminaPg *self = (LaminaPg *) backend;
  int own = PQbackendPID (self->conn);
  gboolean changed = FALSE, seen = FALSE;
  PGnotify *n;

  for (int pass = 0; pass < 2 && !seen; pass++)
    {
      /* The server passes a colleague's notification on when our session
       * is between statements: a trivial one collects what is due, so a
       * commit that has returned is always seen by the next check. */
      if (pass == 1)
        PQclear (PQexec (self->conn, "SELECT 1;"));
      if (!PQconsumeInput (self->conn))
        return FALSE;
      while ((n = PQnotifies (self->conn)) != NULL)
        {
          seen = TRUE;
          if (n->be_pid != own)
            changed = TRUE;
          PQfreemem (n);
        }
    }
  return changed;
}

static const LaminaBackendVTable pg_vtable = {
  .close = lamina_pg_close,
  .check_for_changes = lamina_pg_check_for_changes,

  .list_materials = lamina_pg_list_materials,
  .get_material = lamina_pg_get_material,
  .put_material = lamina_pg_put_material,

  .get_construction = lamina_pg_get_construction,
  .store_revision = lamina_pg_store_revision,
  .set_deleted = lamina_pg_set_deleted,
  .get_history = lamina_pg_get_history,
  .review = lamina_pg_review,
  .get_review_events = lamina_pg_get_review_events,
  .get_setting = lamina_pg_get_setting,
  .set_setting = lamina_pg_set_setting,

  .search = lamina_pg_search,
  .count = lamina_pg_count,
  .list_tags = lamina_pg_list_tags,

  .apply_import = lamina_pg_apply_import,
  .list_ids = lamina_pg_list_ids,
  .list_target_sets = lamina_pg_list_target_sets,
  .put_target_set = lamina_pg_put_target_set,
  .delete_target_set = lamina_pg_delete_target_set,
  .list_jobs = lamina_pg_list_jobs,
  .get_job = lamina_pg_get_job,
  .put_job = lamina_pg_put_job,
  .delete_job = lamina_pg_delete_job,
  .list_job_uses = lamina_pg_list_job_uses,
  .apply_import_records = lamina_pg_apply_import_records,
  .get_field_check = lamina_pg_get_field_check,
  .put_field_check = lamina_pg_put_field_check,

  .list_climates = lamina_pg_list_climates,
  .get_climate = lamina_pg_get_climate,
  .put_climate = lamina_pg_put_climate,

  .delete_climate = lamina_pg_delete_climate,
  .verify_storage = lamina_pg_verify_storage,
  .set_moisture_limit = lamina_pg_set_moisture_limit,
  .write_all = lamina_pg_write_all,
  .server_init = lamina_pg_server_init,
  .replace_draft = lamina_pg_replace_draft,
  .drop_draft = lamina_pg_drop_draft,
  .find_code = lamina_pg_find_code,
  .backup_to = lamina_pg_backup_to,
  .count_at_most = lamina_pg_count_at_most,
  .read_snapshot = lamina_pg_read_snapshot,
  .read_rows = lamina_pg_read_rows,
};

/* What the database holds: -1 no Lamina library (@foreign: other tables
 * are there), else the library format. */
static gboolean
read_version (LaminaPg  *self,
              int       *version,
              gboolean  *foreign,
              GError   **error)
{
  PGresult *res = lamina_pg_query (self,
    "SELECT to_regclass ('meta') IS NOT NULL,"
    "       EXISTS (SELECT 1 FROM pg_catalog.pg_tables"
    "                WHERE schemaname = ANY (current_schemas (false)))", NULL,
    "cannot read the database", error);
  gboolean has_meta;

  if (res == NULL)
    return FALSE;
  has_meta = lamina_pg_bool (res, 0, 0);
  *foreign = lamina_pg_bool (res, 0, 1);
  PQclear (res);
  *version = -1;
  if (!has_meta)
    return TRUE;
  res = lamina_pg_query (self,
    "SELECT (SELECT value FROM meta WHERE key = 'application'),"
    "       (SELECT value FROM meta WHERE key = 'schema_version')", NULL,
    "cannot read the library format", error);
  if (res == NULL)
    return FALSE;
  if (g_strcmp0 (lamina_pg_get (res, 0, 0), "lamina") == 0)
    *version = lamina_pg_int (res, 0, 1);
  PQclear (res);
  return TRUE;
}

typedef struct
{
  LaminaLibraryOpenFlags flags;
  int                    version;   /* found, -1 none */
  gboolean               created;
} Install;

/* Creates or migrates under the lock, looking again: another client may
 * have done it meanwhile. */
static gboolean
install_in_txn (LaminaPg  *self,
                gpointer   data,
                GError   **error)
{
  Install *install = data;
  gboolean foreign = FALSE;

  if (!lamina_pg_exec (self, "SELECT pg_advisory_xact_lock (x'" SCHEMA_LOCK "'::bigint);", error)
      || !read_version (self, &install->version, &foreign, error))
    return FALSE;
  if (install->version >= LAMINA_LIBRARY_SCHEMA_VERSION)
    return TRUE;
  if (install->version < 0)
    {
      if (foreign)
        {
          g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_NOT_A_LIBRARY,
                       "%s: not a Lamina library (the database holds another program's tables); "
                       "nothing was changed", self->label);
          return FALSE;
        }
      install->created = TRUE;
      return lamina_pg_migrate (self, 0, LAMINA_LIBRARY_SCHEMA_VERSION, error)
             && lamina_pg_exec (self, "INSERT INTO meta (key, value) VALUES ('application', 'lamina');",
                                error)
             && (install->flags & LAMINA_LIBRARY_OPEN_NO_SEED || lamina_pg_seed_materials (self, error));
    }
  return lamina_pg_migrate (self, install->version, LAMINA_LIBRARY_SCHEMA_VERSION, error);
}

static gboolean
recognise_and_install (LaminaPg               *self,
                       LaminaLibraryOpenFlags  flags,
                       GError                **error)
{
  Install install = { flags, -1, FALSE };
  gboolean foreign = FALSE;
  PGresult *res;

  if (!read_version (self, &install.version, &foreign, error))
    return FALSE;
  if (install.version > LAMINA_LIBRARY_SCHEMA_VERSION)
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_TOO_NEW,
                   "%s: made by a newer version of Lamina (library format %d; this version "
                   "reads up to %d); the library was not changed",
                   self->label, install.version, LAMINA_LIBRARY_SCHEMA_VERSION);
      return FALSE;
    }
  if (install.version < 0 && foreign)
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_NOT_A_LIBRARY,
                   "%s: not a Lamina library (the database holds another program's tables); "
                   "nothing was changed", self->label);
      return FALSE;
    }
  if (install.version < 0 && (flags & LAMINA_LIBRARY_OPEN_EXISTING))
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_IO,
                   "%s: no Lamina library in this database (make one with "
                   "“lamina-cli server-init”)", self->label);
      return FALSE;
    }
  self->parent.opened_version = install.version;
  if (install.version < LAMINA_LIBRARY_SCHEMA_VERSION && (flags & LAMINA_LIBRARY_OPEN_READ_ONLY))
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_READ_ONLY,
                   install.version < 0
                   ? "%s: no Lamina library in this database, and it was opened read-only"
                   : "%s: the library needs an update to this version's format, and it was "
                     "opened read-only; nothing was changed", self->label);
      return FALSE;
    }
  if (install.version < LAMINA_LIBRARY_SCHEMA_VERSION
      && !lamina_pg_transaction (self, install_in_txn, &install, error))
    return FALSE;
  if (install.created)
    self->parent.opened_version = 0;
  res = lamina_pg_query (self, "SELECT value = 'on' FROM meta WHERE key = 'server_roles'", NULL,
                         "cannot read the library settings", error);
  if (res == NULL)
    return FALSE;
  self->roles = PQntuples (res) > 0 && lamina_pg_bool (res, 0, 0);
  PQclear (res);
  /* A person whose server role may only read: say so before any edit. */
  res = lamina_pg_query (self, "SELECT has_table_privilege ('construction', 'INSERT')", NULL,
                         "cannot read the library settings", error);
  if (res == NULL)
    return FALSE;
  if (flags & LAMINA_LIBRARY_OPEN_READ_ONLY)
    self->parent.read_only_reason = g_strdup ("opened read-only");
  else if (!lamina_pg_bool (res, 0, 0))
    self->parent.read_only_reason = g_strdup ("the server grants your role reading only");
  PQclear (res);
  if (self->parent.read_only_reason != NULL
      && !lamina_pg_exec (self, "SET default_transaction_read_only = on;", error))
    return FALSE;
  return lamina_pg_exec (self, "LISTEN " LAMINA_PG_CHANNEL ";", error);
}

PGconn *
lamina_pg_connect_raw (const char *conninfo,
                       const char *password)
{
  /* Settings before dbname are defaults the connection string may
   * change; the password after it wins. */
  const char *keywords[] = { "connect_timeout", "fallback_application_name", "dbname",
                             "password", NULL };
  const char *values[] = { "20", g_get_prgname () ? g_get_prgname () : "lamina", conninfo,
                           password, NULL };

  if (password == NULL)
    keywords[3] = NULL;
  return PQconnectdbParams (keywords, values, 1);
}

/* Connects and sets the session up; NULL with @error on failure. */
LaminaPg *
lamina_pg_connect (const char  *conninfo,
                   const char  *password,
                   GError     **error)
{
  LaminaPg *self = g_new0 (LaminaPg, 1);
  g_autofree char *lock_timeout = NULL;

  self->parent.vtable = &pg_vtable;
  self->parent.path = g_strdup (conninfo);
  self->parent.busy_timeout = lamina_backend_default_busy_timeout ();
  self->password = g_strdup (password);
  self->label = dup_label (conninfo);
  self->statements = g_hash_table_new_full (g_str_hash, g_str_equal, g_free, g_free);
  self->conn = lamina_pg_connect_raw (conninfo, password);
  if (PQstatus (self->conn) != CONNECTION_OK)
    {
      g_auto(GStrv) lines = g_strsplit (PQerrorMessage (self->conn), "\n", -1);
      g_autofree char *message = NULL;

      /* libpq's lines (a reason, then a hint indented by a tab) as one
       * sentence for a dialog's label or a terminal line. */
      for (guint i = 0; lines[i] != NULL; i++)
        g_strstrip (lines[i]);
      message = g_strjoinv ("; ", lines);
      while (g_str_has_suffix (message, "; "))
        message[strlen (message) - 2] = '\0';
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_IO,
                   "%s: cannot connect to the library server: %s", self->label, message);
      lamina_pg_close (&self->parent);
      return NULL;
    }
  /* A colleague's lock is waited for as long as a file's (the busy
   * timeout), and the wait is reported meanwhile (lamina-pg-util.c). */
  lock_timeout = g_strdup_printf ("SET client_min_messages = warning;"
                                  "SET lock_timeout = %d;",
                                  (int) (self->parent.busy_timeout * 1000));
  if (PQsetClientEncoding (self->conn, "UTF8") != 0
      || !lamina_pg_exec (self, lock_timeout, error))
    {
      if (error != NULL && *error == NULL)
        g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_IO,
                     "%s: the server cannot speak UTF-8", self->label);
      lamina_pg_close (&self->parent);
      return NULL;
    }
  return self;
}

LaminaBackend *
lamina_pg_backend_open (const char             *conninfo,
                        const char             *password,
                        LaminaLibraryOpenFlags  flags,
                        GError                **error)
{
  LaminaPg *self = lamina_pg_connect (conninfo, password, error);

  if (self == NULL)
    return NULL;
  if (!recognise_and_install (self, flags, error))
    {
      lamina_pg_close (&self->parent);
      return NULL;
    }
  return &self->parent;
}
