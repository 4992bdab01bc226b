/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-library-jobs.c: target sets and jobs in the office library, the
 * check of a job against its targets with what the library knows about
 * each pinned revision, and the import of both from a catalogue. */
#define G_LOG_DOMAIN "lamina-store"

#include "lamina-library-backend.h"

#include <math.h>
#include <string.h>

void
lamina_job_use_free (LaminaJobUse *use)
{
  if (use == NULL)
    return;
  g_free (use->job_id);
  g_free (use->job_name);
  g_free (use->job_number);
  g_free (use->use);
  g_free (use);
}

static gboolean
refuse (GError    **error,
        const char *format,
        ...) G_GNUC_PRINTF (2, 3);

static gboolean
refuse (GError    **error,
        const char *format,
        ...)
{
  g_autofree char *message = NULL;
  va_list args;

  va_start (args, format);
  message = g_strdup_vprintf (format, args);
  va_end (args);
  g_set_error_literal (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_INVALID, message);
  return FALSE;
}

/* Target sets */

GPtrArray *
lamina_library_list_target_sets (LaminaLibrary  *self,
                                 GError        **error)
{
  g_return_val_if_fail (LAMINA_IS_LIBRARY (self), NULL);
  BACKEND_OR_FAIL (self, error, NULL);
  return VT (self)->list_target_sets (BE (self), error);
}

static LaminaTargetSet *
find_target_set (GPtrArray  *sets,
                 const char *id)
{
  for (guint i = 0; sets != NULL && i < sets->len; i++)
    if (g_strcmp0 (((LaminaTargetSet *) sets->pdata[i])->id, id) == 0)
      return sets->pdata[i];
  return NULL;
}

LaminaTargetSet *
lamina_library_dup_target_set (LaminaLibrary  *self,
                               const char     *id,
                               GError        **error)
{
  g_autoptr(GPtrArray) sets = lamina_library_list_target_sets (self, error);
  LaminaTargetSet *set;

  if (sets == NULL)
    return NULL;
  set = find_target_set (sets, id);
  if (set == NULL)
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_NOT_FOUND,
                   "no target set “%s”", id);
      return NULL;
    }
  return lamina_target_set_copy (set);
}

gboolean
lamina_library_put_target_set (LaminaLibrary          *self,
                               const LaminaTargetSet  *set,
                               GError                **error)
{
  g_autoptr(GError) local = NULL;
  g_autofree char *now = lamina_library_dup_now ();

  g_return_val_if_fail (LAMINA_IS_LIBRARY (self), FALSE);
  g_return_val_if_fail (set != NULL, FALSE);
  BACKEND_OR_FAIL (self, error, FALSE);
  if (!lamina_target_set_validate (set, NULL, &local))
    return refuse (error, "%s", local->message);
  if (!VT (self)->put_target_set (BE (self), set, now, error))
    return FALSE;
  lamina_library_emit_changed (self);
  return TRUE;
}

gboolean
lamina_library_delete_target_set (LaminaLibrary  *self,
                                  const char     *id,
                                  GError        **error)
{
  g_autoptr(GPtrArray) jobs = lamina_library_list_jobs (self, error);

  if (jobs == NULL)
    return FALSE;
  for (guint i = 0; i < jobs->len; i++)
    {
      const LaminaJob *job = jobs->pdata[i];

      if (g_strcmp0 (job->target_set, id) == 0)
        return refuse (error, "the job “%s” uses the target set “%s”; it was not deleted",
                       job->id, id);
    }
  if (!VT (self)->delete_target_set (BE (self), id, error))
    return FALSE;
  lamina_library_emit_changed (self);
  return TRUE;
}

/* Jobs */

GPtrArray *
lamina_library_list_jobs (LaminaLibrary  *self,
                          GError        **error)
{
  g_return_val_if_fail (LAMINA_IS_LIBRARY (self), NULL);
  BACKEND_OR_FAIL (self, error, NULL);
  return VT (self)->list_jobs (BE (self), error);
}

LaminaJob *
lamina_library_dup_job (LaminaLibrary  *self,
                        const char     *id,
                        GError        **error)
{
  g_return_val_if_fail (LAMINA_IS_LIBRARY (self), NULL);
  g_return_val_if_fail (id != NULL, NULL);
  BACKEND_OR_FAIL (self, error, NULL);
  return VT (self)->get_job (BE (self), id, error);
}

/* "“ID” (NAME)" of @job, for a message. */
static char *
dup_job_label (const LaminaJob *job)
{
  return g_strdup_printf ("“%s” (%s%s%s)", job->id, job->number ? job->number : "",
                          job->number ? ", " : "", job->name);
}

char *
lamina_library_dup_job_id (LaminaLibrary  *self,
                           const char     *key,
                           GError        **error)
{
  g_autoptr(GPtrArray) jobs = NULL;
  g_autoptr(GPtrArray) by_number = g_ptr_array_new ();
  g_autoptr(GString) names = NULL;
  const LaminaJob *by_id = NULL;

  g_return_val_if_fail (LAMINA_IS_LIBRARY (self), NULL);
  g_return_val_if_fail (key != NULL, NULL);
  BACKEND_OR_FAIL (self, error, NULL);
  jobs = VT (self)->list_jobs (BE (self), error);
  if (jobs == NULL)
    return NULL;
  for (guint i = 0; i < jobs->len; i++)
    {
      const LaminaJob *job = jobs->pdata[i];

      if (strcmp (job->id, key) == 0)
        by_id = job;
      else if (job->number != NULL && g_ascii_strcasecmp (job->number, key) == 0)
        g_ptr_array_add (by_number, (gpointer) job);
    }
  if (by_id != NULL && by_number->len == 0)
    return g_strdup (by_id->id);
  if (by_id == NULL && by_number->len == 1)
    return g_strdup (((const LaminaJob *) by_number->pdata[0])->id);
  if (by_id == NULL && by_number->len == 0)
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_NOT_FOUND,
                   "no job “%s” (by id or job number)", key);
      return NULL;
    }
  names = g_string_new (NULL);
  for (guint i = 0; i < by_number->len; i++)
    {
      g_autofree char *label = dup_job_label (by_number->pdata[i]);

      g_string_append_printf (names, "%s%s", i > 0 ? ", " : "", label);
    }
  if (by_id != NULL)
    {
      g_autofree char *label = dup_job_label (by_id);

      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_INVALID,
                   "“%s” is the id of the job %s and the job number of the job %s: "
                   "change that job number, or name the job you mean by its number or id", key, label, names->str);
    }
  else
    g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_INVALID,
                 "“%s” is the job number of %u jobs: %s; name the job by its id",
                 key, by_number->len, names->str);
  return NULL;
}

static char *
dup_uses (const LaminaTargetSet *set)
{
  g_autoptr(GString) text = g_string_new (NULL);

  for (guint i = 0; i < set->targets->len; i++)
    g_string_append_printf (text, "%s%s", i > 0 ? ", " : "",
                            ((LaminaTarget *) set->targets->pdata[i])->use);
  return g_string_free (g_steal_pointer (&text), FALSE);
}

static char *
dup_climate_ids (GPtrArray *climates)
{
  g_autoptr(GString) text = g_string_new (NULL);

  for (guint i = 0; i < climates->len; i++)
    g_string_append_printf (text, "%s%s", i > 0 ? ", " : "",
                            ((LaminaClimate *) climates->pdata[i])->id);
  return g_string_free (g_steal_pointer (&text), FALSE);
}

/* The job's own rules, its climate in @climates, its target set in @sets
 * and its uses in the set. */
static gboolean
check_job (const LaminaJob *job,
           GPtrArray       *sets,
           GPtrArray       *climates,
           GError         **error)
{
  g_autoptr(GError) local = NULL;
  const LaminaTargetSet *set;
  gboolean known = job->climate == NULL;

  if (!lamina_job_validate (job, NULL, &local))
    return refuse (error, "%s", local->message);
  for (guint i = 0; !known && i < climates->len; i++)
    known = g_strcmp0 (((LaminaClimate *) climates->pdata[i])->id, job->climate) == 0;
  if (!known)
    {
      g_autofree char *ids = dup_climate_ids (climates);

      return refuse (error, "job “%s”, climate: there is no climate “%s” in the library (its climates: %s)",
                     job->id, job->climate, climates->len > 0 ? ids : "none");
    }
  if (job->target_set == NULL)
    return TRUE;
  set = find_target_set (sets, job->target_set);
  if (set == NULL)
    return refuse (error, "job “%s”: there is no target set “%s”", job->id, job->target_set);
  for (guint i = 0; i < job->entries->len; i++)
    {
      const LaminaJobEntry *e = job->entries->pdata[i];

      if (lamina_target_set_find (set, e->use) == NULL)
        {
          g_autofree char *uses = dup_uses (set);

          return refuse (error, "job “%s”, entry %d: the use “%s” is not in the target set “%s” "
                         "(its uses: %s)", job->id, e->n, e->use, set->id, uses);
        }
    }
  return TRUE;
}

static gboolean
store_job (LaminaLibrary *self,
           LaminaJob     *job,
           gboolean       create,
           GError       **error)
{
  g_autoptr(GPtrArray) sets = NULL;
  g_autoptr(GPtrArray) climates = NULL;

  g_return_val_if_fail (LAMINA_IS_LIBRARY (self), FALSE);
  g_return_val_if_fail (job != NULL, FALSE);
  BACKEND_OR_FAIL (self, error, FALSE);
  sets = VT (self)->list_target_sets (BE (self), error);
  climates = sets != NULL ? VT (self)->list_climates (BE (self), error) : NULL;
  if (climates == NULL || !check_job (job, sets, climates, error))
    return FALSE;
  g_free (job->modified_at);
  job->modified_at = lamina_library_dup_now ();
  if (!VT (self)->put_job (BE (self), job, create, error))
    return FALSE;
  lamina_library_emit_changed (self);
  return TRUE;
}

gboolean
lamina_library_create_job (LaminaLibrary  *self,
                           LaminaJob      *job,
                           GError        **error)
{
  return store_job (self, job, TRUE, error);
}

gboolean
lamina_library_save_job (LaminaLibrary  *self,
                         LaminaJob      *job,
                         GError        **error)
{
  return store_job (self, job, FALSE, error);
}

gboolean
lamina_library_delete_job (LaminaLibrary  *self,
                           const char     *id,
                           GError        **error)
{
  g_return_val_if_fail (LAMINA_IS_LIBRARY (self), FALSE);
  BACKEND_OR_FAIL (self, error, FALSE);
  if (!VT (self)->delete_job (BE (self), id, error))
    return FALSE;
  lamina_library_emit_changed (self);
  return TRUE;
}

GPtrArray *
lamina_library_list_job_uses (LaminaLibrary  *self,
                              const char     *construction_id,
                              GError        **error)
{
  g_return_val_if_fail (LAMINA_IS_LIBRARY (self), NULL);
  g_return_val_if_fail (construction_id != NULL, NULL);
  BACKEND_OR_FAIL (self, error, NULL);
  return VT (self)->list_job_uses (BE (self), construction_id, error);
}

/* Revisions */

/* The newest approved revision of @history (newest first), 0 if none. */
static int
newest_approved (GPtrArray *history)
{
  for (guint i = 0; i < history->len; i++)
    {
      const LaminaRevisionInfo *info = history->pdata[i];

      if (info->status == LAMINA_STATUS_APPROVED)
        return info->revision;
    }
  return 0;
}

int
lamina_library_pick_revision (LaminaLibrary  *self,
                              const char     *construction_id,
                              int             revision,
                              gboolean       *approved,
                              GError        **error)
{
  g_autoptr(GPtrArray) history = lamina_library_dup_history (self, construction_id, error);

  if (history == NULL)
    return 0;
  if (history->len == 0)
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_NOT_FOUND,
                   "no construction “%s”", construction_id);
      return 0;
    }
  for (guint i = 0; revision > 0 && i < history->len; i++)
    {
      const LaminaRevisionInfo *info = history->pdata[i];

      if (info->revision == revision)
        {
          if (approved != NULL)
            *approved = info->status == LAMINA_STATUS_APPROVED;
          return revision;
        }
    }
  if (revision > 0)
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_NOT_FOUND,
                   "“%s” has no revision %d", construction_id, revision);
      return 0;
    }
  revision = newest_approved (history);
  if (approved != NULL)
    *approved = revision > 0;
  return revision > 0 ? revision : ((LaminaRevisionInfo *) history->pdata[0])->revision;
}

/* The check */

void
lamina_job_report_free (LaminaJobReport *report)
{
  if (report == NULL)
    return;
  lamina_job_check_free (report->check);
  g_free (report->inputs);
  g_clear_pointer (&report->results, g_ptr_array_unref);
  g_clear_pointer (&report->constructions, g_ptr_array_unref);
  g_clear_pointer (&report->moisture, g_ptr_array_unref);
  g_clear_pointer (&report->moisture_problems, g_ptr_array_unref);
  lamina_climate_free (report->climate);
  lamina_target_set_free (report->targets);
  lamina_job_free (report->job);
  g_free (report);
}

static void
result_free (gpointer result)
{
  if (result != NULL)
    lamina_result_free (result);
}

static void
construction_free (gpointer c)
{
  if (c != NULL)
    lamina_construction_free (c);
}

static void
moisture_free (gpointer result)
{
  if (result != NULL)
    lamina_moisture_result_free (result);
}

/* The climate data @c was checked with differ from the library's. */
static gboolean
climate_changed (LaminaLibrary            *self,
                 const LaminaConstruction *c)
{
  g_autoptr(LaminaClimate) library = NULL;

  if (c->moisture == NULL || c->moisture->climate_data == NULL)
    return FALSE;
  library = lamina_library_dup_climate (self, c->moisture->climate, NULL);
  return library != NULL && !lamina_climate_equal (library, c->moisture->climate_data);
}

/* The job's climate (one the library holds) in place of the one @c was
 * checked for, so that the sheets issued for the job show the moisture
 * check its schedule reports. */
static void
use_job_climate (LaminaConstruction  *c,
                 const LaminaClimate *climate)
{
  if (climate == NULL || c->moisture == NULL)
    return;
  g_free (c->moisture->climate);
  c->moisture->climate = g_strdup (climate->id);
  g_clear_pointer (&c->moisture->climate_data, lamina_climate_free);
  c->moisture->climate_data = lamina_climate_copy (climate);
}

/* EN ISO 13788 for entry @e when its use asks a moisture criterion: in
 * the job's climate when it names one the library holds, else in the
 * climate the construction was checked for (use_job_climate has put it
 * in @c); the inside conditions are the construction's (humidity class or
 * φi) at the job's temperature. */
static void
assess_moisture (LaminaJobReport          *report,
                 const LaminaJobEntry     *e,
                 const LaminaConstruction *c,
                 LaminaJobInput           *input)
{
  const LaminaTarget *t = report->targets ? lamina_target_set_find (report->targets, e->use) : NULL;
  g_autoptr(GError) error = NULL;
  LaminaMoistureResult *result = NULL;
  char *problem = NULL;

  if (t == NULL || (t->moisture == LAMINA_MOISTURE_NONE && isnan (t->min_frsi)))
    ;
  else if (c->moisture == NULL)
    problem = g_strdup_printf ("“%s” has no moisture settings (inside humidity), so EN ISO 13788 "
                               "was not applied.", c->code ? c->code : c->id);
  else
    {
      result = lamina_moisture_calculate_own (c, NAN, &error);
      if (result == NULL)
        problem = g_strdup_printf ("EN ISO 13788 could not be applied: %s", error->message);
    }
  input->moisture = result;
  input->moisture_problem = problem;
  g_ptr_array_add (report->moisture, result);
  g_ptr_array_add (report->moisture_problems, problem);
}

/* What the library knows about one entry's pin. */
static void
fill_input (LaminaLibrary        *self,
            LaminaJobReport      *report,
            const LaminaJobEntry *e,
            LaminaJobInput       *input)
{
  g_autoptr(LaminaConstruction) c = lamina_library_dup_construction (self, e->construction,
                                                                     e->revision, NULL);
  g_autoptr(GPtrArray) history = lamina_library_dup_history (self, e->construction, NULL);
  g_autoptr(GPtrArray) changes = NULL;
  LaminaResult *result = NULL;
  int newest;

  if (c == NULL)
    {
      input->flags |= LAMINA_ENTRY_MISSING;
      g_ptr_array_add (report->constructions, NULL);
      g_ptr_array_add (report->results, NULL);
      g_ptr_array_add (report->moisture, NULL);
      g_ptr_array_add (report->moisture_problems, NULL);
      return;
    }
  /* The job's design conditions (they move the temperature profile on
   * the sheets) and its ground floor's plan (B′ moves the U of a floor
   * with the ground). */
  lamina_job_apply_conditions (report->job, c);
  result = lamina_calculate (c, NULL);
  newest = history != NULL ? newest_approved (history) : 0;
  if (newest > e->revision)
    {
      input->flags |= LAMINA_ENTRY_NEWER_APPROVED;
      input->newer_revision = newest;
    }
  changes = lamina_library_collect_material_changes (self, c);
  if (changes->len > 0)
    input->flags |= LAMINA_ENTRY_MATERIAL_CHANGED;
  if (climate_changed (self, c))
    input->flags |= LAMINA_ENTRY_CLIMATE_CHANGED;
  use_job_climate (c, report->climate);
  assess_moisture (report, e, c, input);
  input->construction = c;
  input->result = result;
  g_ptr_array_add (report->constructions, g_steal_pointer (&c));
  g_ptr_array_add (report->results, result);
}

LaminaJobReport *
lamina_library_check_job (LaminaLibrary  *self,
                          const char     *id,
                          GError        **error)
{
  g_autoptr(LaminaJobReport) report = g_new0 (LaminaJobReport, 1);
  guint n;

  report->job = lamina_library_dup_job (self, id, error);
  if (report->job == NULL)
    return NULL;
  if (report->job->target_set != NULL)
    {
      report->targets = lamina_library_dup_target_set (self, report->job->target_set, error);
      if (report->targets == NULL)
        return NULL;
    }
  if (report->job->climate != NULL)
    {
      report->climate = lamina_library_dup_climate (self, report->job->climate, NULL);
      report->climate_unknown = report->climate == NULL;
    }
  n = report->job->entries->len;
  report->moisture = g_ptr_array_new_with_free_func (moisture_free);
  report->moisture_problems = g_ptr_array_new_with_free_func (g_free);
  report->constructions = g_ptr_array_new_with_free_func (construction_free);
  report->results = g_ptr_array_new_with_free_func (result_free);
  report->inputs = g_new0 (LaminaJobInput, MAX (n, 1));
  for (guint i = 0; i < n; i++)
    fill_input (self, report, report->job->entries->pdata[i], &report->inputs[i]);
  report->check = lamina_job_check (report->job, report->targets, report->inputs, n);
  return g_steal_pointer (&report);
}

gboolean
lamina_library_move_job_entry (LaminaLibrary  *self,
                               const char     *id,
                               int             n,
                               int             revision,
                               const char     *author,
                               GError        **error)
{
  g_autoptr(LaminaJob) job = lamina_library_dup_job (self, id, error);
  g_autofree char *now = lamina_library_dup_now ();
  LaminaJobEntry *e;

  if (job == NULL)
    return FALSE;
  e = lamina_job_find_entry (job, n);
  if (e == NULL)
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_NOT_FOUND,
                   "job “%s” has no entry %d", id, n);
      return FALSE;
    }
  if (revision == 0)
    {
      g_autoptr(GPtrArray) history = lamina_library_dup_history (self, e->construction, error);

      if (history == NULL)
        return FALSE;
      revision = newest_approved (history);
      if (revision == 0)
        return refuse (error, "“%s” has no approved revision to move to", e->construction);
    }
  else if (lamina_library_pick_revision (self, e->construction, revision, NULL, error) == 0)
    return FALSE;
  lamina_job_move_entry (job, n, revision, now, lamina_library_default_author (author));
  return lamina_library_save_job (self, job, error);
}

/* Exchange */

gboolean
lamina_library_export_records (LaminaLibrary   *self,
                               LaminaCatalogue *catalogue,
                               GError         **error)
{
  g_autoptr(GPtrArray) sets = VT (self)->list_target_sets (BE (self), error);
  g_autoptr(GPtrArray) jobs = sets != NULL ? VT (self)->list_jobs (BE (self), error) : NULL;

  if (jobs == NULL)
    return FALSE;
  g_ptr_array_extend_and_steal (catalogue->target_sets, g_steal_pointer (&sets));
  g_ptr_array_extend_and_steal (catalogue->jobs, g_steal_pointer (&jobs));
  return TRUE;
}

/* The revision the import stores for document construction @id, or 0. */
static int
stored_revision (const LaminaImportReport *report,
                 const char               *id)
{
  for (guint i = 0; i < report->items->len; i++)
    {
      const LaminaImportItem *item = report->items->pdata[i];

      if (!item->is_material && g_strcmp0 (item->id, id) == 0
          && item->action != LAMINA_IMPORT_CONFLICT)
        return item->revision;
    }
  return 0;
}

/* A document entry pins the document's construction at the revision the
 * document carries; in the library that content lands at the revision the
 * import stores.  Otherwise the pin must exist in the library already. */
static gboolean
repin_entry (LaminaLibrary            *self,
             const LaminaCatalogue    *catalogue,
             const LaminaImportReport *report,
             const LaminaJob          *job,
             LaminaJobEntry           *e,
             GError                  **error)
{
  const LaminaConstruction *c = lamina_catalogue_find (catalogue, e->construction);
  g_autoptr(LaminaConstruction) stored = NULL;

  if (c != NULL && (c->revision == e->revision || c->revision == 0))
    {
      int revision = stored_revision (report, c->id);

      if (revision > 0)
        {
          e->revision = revision;
          return TRUE;
        }
    }
  stored = lamina_library_dup_construction (self, e->construction, e->revision, NULL);
  if (stored == NULL && c != NULL && stored_revision (report, c->id) > 0)
    {
      /* A document carries one revision of each construction: an entry
       * pinned at another one takes the revision imported, said in the
       * job's log and shown as a move on its sheet. */
      g_autofree char *now = lamina_library_dup_now ();
      g_autofree char *text = g_strdup_printf ("entry %d (%s): revision %d was not in the library; "
                                               "pinned to revision %d as imported",
                                               e->n, e->construction, e->revision,
                                               stored_revision (report, c->id));

      e->revision = stored_revision (report, c->id);
      lamina_job_log ((LaminaJob *) job, now, NULL, text);
      return TRUE;
    }
  if (stored == NULL)
    return refuse (error, "job “%s” (line %d), entry %d: revision %d of “%s” is neither in the "
                   "document nor in the library; nothing was imported",
                   job->id, e->line, e->n, e->revision, e->construction);
  return TRUE;
}

static void
report_record (LaminaImportReport *report,
               gboolean            same,
               gboolean            known,
               const char         *kind,
               const char         *id,
               const char         *name)
{
  LaminaImportAction action = same ? LAMINA_IMPORT_SKIPPED
                              : known ? LAMINA_IMPORT_REVISED : LAMINA_IMPORT_ADDED;
  const char *verb = same ? "unchanged" : known ? "replaced" : "added";

  lamina_import_report_add_item (report, action, FALSE, id, name, 0,
                                 g_strdup_printf ("%s “%s” %s", kind, name, verb));
}

gboolean
lamina_library_merge_records (LaminaLibrary         *self,
                              const LaminaCatalogue *catalogue,
                              LaminaImportReport    *report,
                              GPtrArray             *target_sets,
                              GPtrArray             *jobs,
                              GError               **error)
{
  g_autoptr(GPtrArray) sets = NULL;
  g_autoptr(GPtrArray) known_jobs = NULL;
  g_autoptr(GPtrArray) climates = NULL;

  if (catalogue->target_sets->len == 0 && catalogue->jobs->len == 0)
    return TRUE;
  sets = VT (self)->list_target_sets (BE (self), error);
  known_jobs = sets != NULL ? VT (self)->list_jobs (BE (self), error) : NULL;
  climates = known_jobs != NULL ? VT (self)->list_climates (BE (self), error) : NULL;
  if (climates == NULL)
    return FALSE;
  /* A job may name a climate the same document brings. */
  for (guint i = 0; catalogue->climates != NULL && i < catalogue->climates->len; i++)
    g_ptr_array_add (climates, lamina_climate_copy (catalogue->climates->pdata[i]));
  for (guint i = 0; i < catalogue->target_sets->len; i++)
    {
      const LaminaTargetSet *set = catalogue->target_sets->pdata[i];
      LaminaTargetSet *known = find_target_set (sets, set->id);
      gboolean same = known != NULL && lamina_target_set_equal (known, set);

      report_record (report, same, known != NULL, "target set", set->id, set->name);
      if (same)
        continue;
      if (known != NULL)
        g_ptr_array_remove (sets, known);
      g_ptr_array_add (sets, lamina_target_set_copy (set));
      g_ptr_array_add (target_sets, lamina_target_set_copy (set));
    }
  for (guint i = 0; i < catalogue->jobs->len; i++)
    {
      g_autoptr(LaminaJob) job = lamina_job_copy (catalogue->jobs->pdata[i]);
      const LaminaJob *known = NULL;
      gboolean same;

      for (guint k = 0; k < known_jobs->len && known == NULL; k++)
        if (g_strcmp0 (((LaminaJob *) known_jobs->pdata[k])->id, job->id) == 0)
          known = known_jobs->pdata[k];
      for (guint k = 0; k < job->entries->len; k++)
        if (!repin_entry (self, catalogue, report, job, job->entries->pdata[k], error))
          return FALSE;
      if (!check_job (job, sets, climates, error))
        {
          g_prefix_error (error, "line %d: ", job->line);
          g_prefix_error (error, "nothing was imported: ");
          return FALSE;
        }
      same = known != NULL && lamina_job_equal (known, job);
      report_record (report, same, known != NULL, "job", job->id, job->name);
      if (!same)
        g_ptr_array_add (jobs, g_steal_pointer (&job));
    }
  return TRUE;
}
