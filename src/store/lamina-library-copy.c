/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-library-copy.c: the whole library from one backend to another
 * as stored (read here through the backends' read_snapshot and read_rows)
 * and written by the target's write_all, so that any pair of backends
 * works. */
#define G_LOG_DOMAIN "lamina-store"

#include "lamina-library-copy.h"

#include "lamina-library-backend.h"
#include "lamina-store-json.h"

#include <string.h>

static void
record_revision_free (LaminaBackendRecordRevision *rev)
{
  g_free (rev->body);
  g_free (rev->calc_error);
  g_free (rev->modified_by);
  g_free (rev->modified_at);
  g_free (rev->checked_by);
  g_free (rev->checked_at);
  g_free (rev->approved_by);
  g_free (rev->approved_at);
  g_free (rev->comment);
  g_free (rev->field_check);
  g_free (rev->field_check_at);
  g_clear_pointer (&rev->construction, lamina_construction_free);
  g_free (rev);
}

LaminaBackendRecordRevision *
lamina_backend_record_revision_new (void)
{
  return g_new0 (LaminaBackendRecordRevision, 1);
}

static void
record_free (LaminaBackendRecord *record)
{
  g_free (record->id);
  g_free (record->deleted_at);
  g_ptr_array_unref (record->revisions);
  g_ptr_array_unref (record->review_events);
  g_free (record);
}

LaminaBackendRecord *
lamina_backend_record_new (const char *id)
{
  LaminaBackendRecord *record = g_new0 (LaminaBackendRecord, 1);

  record->id = g_strdup (id);
  record->revisions = g_ptr_array_new_with_free_func ((GDestroyNotify) record_revision_free);
  record->review_events = g_ptr_array_new_with_free_func ((GDestroyNotify) lamina_review_event_free);
  return record;
}

LaminaBackendDump *
lamina_backend_dump_new (void)
{
  LaminaBackendDump *dump = g_new0 (LaminaBackendDump, 1);

  dump->settings = g_ptr_array_new_with_free_func (g_free);
  dump->materials = g_ptr_array_new_with_free_func ((GDestroyNotify) lamina_material_free);
  dump->material_times = g_ptr_array_new_with_free_func (g_free);
  dump->climates = g_ptr_array_new_with_free_func ((GDestroyNotify) lamina_climate_free);
  dump->climate_times = g_ptr_array_new_with_free_func (g_free);
  dump->target_sets = g_ptr_array_new_with_free_func ((GDestroyNotify) lamina_target_set_free);
  dump->target_set_times = g_ptr_array_new_with_free_func (g_free);
  dump->jobs = g_ptr_array_new_with_free_func ((GDestroyNotify) lamina_job_free);
  dump->constructions = g_ptr_array_new_with_free_func ((GDestroyNotify) record_free);
  return dump;
}

void
lamina_backend_dump_free (LaminaBackendDump *dump)
{
  if (dump == NULL)
    return;
  g_ptr_array_unref (dump->settings);
  g_ptr_array_unref (dump->materials);
  g_ptr_array_unref (dump->material_times);
  g_ptr_array_unref (dump->climates);
  g_ptr_array_unref (dump->climate_times);
  g_ptr_array_unref (dump->target_sets);
  g_ptr_array_unref (dump->target_set_times);
  g_ptr_array_unref (dump->jobs);
  g_ptr_array_unref (dump->constructions);
  g_free (dump);
}

G_DEFINE_AUTOPTR_CLEANUP_FUNC (LaminaBackendDump, lamina_backend_dump_free)

/* ---- Reading the source, as stored ------------------------------------- */

/* Settings that describe the database a library is kept in, not the
 * library: never copied. */
static gboolean
own_setting (const char *key)
{
  return g_strcmp0 (key, "schema_version") == 0 || g_strcmp0 (key, "application") == 0
         || g_strcmp0 (key, "server_roles") == 0;
}

static void
add_setting_row (const LaminaBackendValue *v,
                 gpointer                  data)
{
  GPtrArray *pairs = data;

  if (v[0].text == NULL || own_setting (v[0].text))
    return;
  g_ptr_array_add (pairs, g_strdup (v[0].text));
  g_ptr_array_add (pairs, g_strdup (v[1].text));
}

static int
compare_setting_keys (gconstpointer a,
                      gconstpointer b)
{
  return strcmp (**(const char *const *const *) a, **(const char *const *const *) b);
}

/* Key, value, key, value …, in the order of the keys' bytes. */
static gboolean
read_settings (LaminaBackend      *backend,
               LaminaBackendDump  *dump,
               GError            **error)
{
  g_autoptr(GPtrArray) pairs = g_ptr_array_new_with_free_func (g_free);
  g_autoptr(GArray) order = g_array_new (FALSE, FALSE, sizeof (char **));

  if (!backend->vtable->read_rows (backend, "SELECT key, value FROM meta", "tt",
                                   add_setting_row, pairs, "cannot read the library settings",
                                   error))
    return FALSE;
  for (guint i = 0; i + 1 < pairs->len; i += 2)
    {
      char **pair = (char **) &pairs->pdata[i];

      g_array_append_val (order, pair);
    }
  g_array_sort (order, compare_setting_keys);
  for (guint i = 0; i < order->len; i++)
    {
      char **pair = g_array_index (order, char **, i);

      g_ptr_array_add (dump->settings, g_steal_pointer (&pair[0]));
      g_ptr_array_add (dump->settings, g_steal_pointer (&pair[1]));
    }
  return TRUE;
}

static void
add_time_row (const LaminaBackendValue *v,
              gpointer                  data)
{
  if (v[0].text != NULL)
    g_hash_table_insert (data, g_strdup (v[0].text), g_strdup (v[1].text));
}

/* @items from @list (stolen) and, in @times, the modified_at of each from
 * the rows of @sql (id, modified_at). */
static gboolean
add_listed (LaminaBackend  *backend,
            const char     *sql,
            GPtrArray      *list,
            gsize           id_offset,
            GPtrArray      *items,
            GPtrArray      *times,
            GError        **error)
{
  g_autoptr(GPtrArray) owned = list;
  g_autoptr(GHashTable) by_id = NULL;

  if (owned == NULL)
    return FALSE;
  by_id = g_hash_table_new_full (g_str_hash, g_str_equal, g_free, g_free);
  if (!backend->vtable->read_rows (backend, sql, "tt", add_time_row, by_id,
                                   "cannot read the library", error))
    return FALSE;
  g_ptr_array_extend_and_steal (items, g_steal_pointer (&owned));
  for (guint i = 0; i < items->len; i++)
    {
      const char *id = G_STRUCT_MEMBER (const char *, items->pdata[i], id_offset);

      g_ptr_array_add (times, g_strdup (g_hash_table_lookup (by_id, id)));
    }
  return TRUE;
}

typedef struct
{
  LaminaBackendDump *dump;
  GHashTable        *by_id;  /* id → LaminaBackendRecord*, not owned */
} ReadConstructions;

static void
add_construction_row (const LaminaBackendValue *v,
                      gpointer                  data)
{
  ReadConstructions *read = data;
  LaminaBackendRecord *record = lamina_backend_record_new (v[0].text);

  record->deleted_at = g_strdup (v[1].text);
  record->flags = (int) v[2].integer;
  record->material_changed = v[3].boolean;
  g_ptr_array_add (read->dump->constructions, record);
  g_hash_table_insert (read->by_id, record->id, record);
}

static LaminaBackendRecord *
record_of_row (ReadConstructions *read,
               const char        *id)
{
  return id != NULL ? g_hash_table_lookup (read->by_id, id) : NULL;
}

static void
add_revision_row (const LaminaBackendValue *v,
                  gpointer                  data)
{
  ReadConstructions *read = data;
  LaminaBackendRecord *record = record_of_row (read, v[0].text);
  LaminaBackendRecordRevision *rev;

  if (record == NULL)
    return;
  rev = lamina_backend_record_revision_new ();
  rev->revision = (int) v[1].integer;
  lamina_status_from_string (v[2].text, &rev->status);
  rev->body = g_strdup (v[3].text);
  rev->u = v[4].real;
  rev->u_corrected = v[5].real;
  rev->r_total = v[6].real;
  rev->thickness = v[7].real;
  rev->calc_error = g_strdup (v[8].text);
  rev->modified_by = g_strdup (v[9].text);
  rev->modified_at = g_strdup (v[10].text);
  rev->checked_by = g_strdup (v[11].text);
  rev->checked_at = g_strdup (v[12].text);
  rev->approved_by = g_strdup (v[13].text);
  rev->approved_at = g_strdup (v[14].text);
  rev->comment = g_strdup (v[15].text);
  rev->field_check = g_strdup (v[16].text);
  rev->field_check_at = g_strdup (v[17].text);
  g_ptr_array_add (record->revisions, rev);
}

static void
add_review_row (const LaminaBackendValue *v,
                gpointer                  data)
{
  ReadConstructions *read = data;
  LaminaBackendRecord *record = record_of_row (read, v[0].text);
  LaminaReviewEvent *e;

  if (record == NULL)
    return;
  e = g_new0 (LaminaReviewEvent, 1);
  e->revision = (int) v[1].integer;
  e->act = g_strdup (v[2].text);
  e->by = g_strdup (v[3].text);
  e->at = g_strdup (v[4].text);
  e->date = g_strdup (v[5].text);
  e->policy = g_strdup (v[6].text);
  e->reason = g_strdup (v[7].text);
  g_ptr_array_add (record->review_events, e);
}

/* Every construction (deleted ones too) in order of creation, with its
 * revisions as stored and its review records. */
static gboolean
read_constructions (LaminaBackend      *backend,
                    LaminaBackendDump  *dump,
                    GError            **error)
{
  g_autoptr(GHashTable) by_id = g_hash_table_new (g_str_hash, g_str_equal);
  ReadConstructions read = { dump, by_id };
  const LaminaBackendVTable *vt = backend->vtable;

  return vt->read_rows (backend,
           "SELECT id, deleted_at, flags, material_changed FROM construction ORDER BY num",
           "ttib", add_construction_row, &read, "cannot read the constructions", error)
         && vt->read_rows (backend,
           "SELECT r.construction_id, r.revision, r.status, r.body, r.u, r.u_corrected,"
           "       r.r_total, r.thickness, r.calc_error, r.modified_by, r.modified_at,"
           "       r.checked_by, r.checked_at, r.approved_by, r.approved_at, r.comment,"
           "       f.body, f.computed_at"
           "  FROM revision r LEFT JOIN field_check f"
           "    ON f.construction_id = r.construction_id AND f.revision = r.revision"
           " ORDER BY r.construction_id, r.revision",
           "titt" "rrrr" "tttt" "tttt" "tt", add_revision_row, &read,
           "cannot read the revisions", error)
         && vt->read_rows (backend,
           "SELECT construction_id, revision, act, person, at, date, policy, reason"
           "  FROM review_event ORDER BY num",
           "titttttt", add_review_row, &read, "cannot read the review records", error);
}

static gboolean
read_all_in_snapshot (LaminaBackend  *backend,
                      gpointer        data,
                      GError        **error)
{
  LaminaBackendDump *dump = data;
  const LaminaBackendVTable *vt = backend->vtable;
  GPtrArray *jobs;

  if (!read_settings (backend, dump, error)
      || !add_listed (backend, "SELECT id, modified_at FROM material",
                      vt->list_materials (backend, error), G_STRUCT_OFFSET (LaminaMaterial, id),
                      dump->materials, dump->material_times, error)
      || !add_listed (backend, "SELECT id, modified_at FROM climate",
                      vt->list_climates (backend, error), G_STRUCT_OFFSET (LaminaClimate, id),
                      dump->climates, dump->climate_times, error)
      || !add_listed (backend, "SELECT id, modified_at FROM target_set",
                      vt->list_target_sets (backend, error),
                      G_STRUCT_OFFSET (LaminaTargetSet, id),
                      dump->target_sets, dump->target_set_times, error))
    return FALSE;
  if ((jobs = vt->list_jobs (backend, error)) == NULL)
    return FALSE;
  g_ptr_array_extend_and_steal (dump->jobs, jobs);
  return read_constructions (backend, dump, error);
}

LaminaBackendDump *
lamina_backend_read_all (LaminaBackend  *backend,
                         GError        **error)
{
  g_autoptr(LaminaBackendDump) dump = lamina_backend_dump_new ();

  if (!backend->vtable->read_snapshot (backend, read_all_in_snapshot, dump, error))
    return NULL;
  return g_steal_pointer (&dump);
}

/* Parses every body (the target indexes tags, materials and search text
 * from them) and counts; fails before anything is written. */
gboolean
lamina_backend_dump_prepare (LaminaBackendDump  *dump,
                             LaminaCopyReport   *report,
                             GError            **error)
{
  report->materials = dump->materials->len;
  report->climates = dump->climates->len;
  report->target_sets = dump->target_sets->len;
  report->jobs = dump->jobs->len;
  report->settings = dump->settings->len / 2;
  for (guint i = 0; i < dump->constructions->len; i++)
    {
      LaminaBackendRecord *record = dump->constructions->pdata[i];

      if (record->revisions->len == 0)
        continue;
      report->constructions++;
      if (record->deleted_at != NULL)
        report->deleted++;
      report->review_records += record->review_events->len;
      for (guint k = 0; k < record->revisions->len; k++)
        {
          LaminaBackendRecordRevision *rev = record->revisions->pdata[k];
          g_autoptr(GError) local = NULL;

          rev->construction = lamina_store_construction_from_json (rev->body, &local);
          if (rev->construction == NULL)
            {
              g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_CORRUPT,
                           "construction “%s” revision %d cannot be read (%s); "
                           "nothing was copied", record->id, rev->revision, local->message);
              return FALSE;
            }
          g_free (rev->construction->id);
          rev->construction->id = g_strdup (record->id);
          rev->construction->revision = rev->revision;
          rev->construction->status = rev->status;
          report->revisions++;
          if (rev->field_check != NULL)
            report->field_checks++;
        }
    }
  return TRUE;
}

gboolean
lamina_library_copy (LaminaLibrary     *from,
                     LaminaLibrary     *to,
                     LaminaCopyReport  *report,
                     GError           **error)
{
  g_autoptr(LaminaBackendDump) dump = NULL;
  LaminaCopyReport counts = { 0 };

  g_return_val_if_fail (LAMINA_IS_LIBRARY (from) && LAMINA_IS_LIBRARY (to), FALSE);
  BACKEND_OR_FAIL (from, error, FALSE);
  BACKEND_OR_FAIL (to, error, FALSE);

  if (from == to || g_strcmp0 (lamina_library_get_path (from), lamina_library_get_path (to)) == 0)
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_INVALID,
                   "%s: a library cannot be copied onto itself", lamina_library_get_path (to));
      return FALSE;
    }
  if (VT (from)->read_snapshot == NULL || VT (from)->read_rows == NULL)
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_FAILED,
                   "%s: copying is not supported by this library", lamina_library_get_path (from));
      return FALSE;
    }
  if (VT (to)->write_all == NULL)
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_FAILED,
                   "%s: copying is not supported by this library", lamina_library_get_path (to));
      return FALSE;
    }

  dump = lamina_backend_read_all (BE (from), error);
  if (dump == NULL)
    {
      g_prefix_error (error, "%s: ", lamina_library_get_path (from));
      return FALSE;
    }
  if (!lamina_backend_dump_prepare (dump, &counts, error))
    {
      g_prefix_error (error, "%s: ", lamina_library_get_path (from));
      return FALSE;
    }
  if (!VT (to)->write_all (BE (to), dump, error))
    {
      g_prefix_error (error, "%s: ", lamina_library_get_path (to));
      return FALSE;
    }
  lamina_library_emit_changed (to);
  if (report != NULL)
    *report = counts;
  return TRUE;
}
