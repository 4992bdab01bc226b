/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-library-copy.c: the whole library from one backend to another
 * through read_all and write_all, so that any pair of backends works. */
#define G_LOG_DOMAIN "lamina-store"

#include "lamina-library-copy.h"

#include "lamina-library-backend.h"
#include "lamina-store-json.h"

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
  if (VT (from)->read_all == NULL)
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

  dump = VT (from)->read_all (BE (from), error);
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
