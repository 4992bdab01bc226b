/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "lamina-core"

#include "lamina-job.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <string.h>

#include "lamina-construction.h"
#include "lamina-error.h"
#include "lamina-record-private.h"
#include "lamina-target-set.h"

static const char *const job_status_names[] = {
  "design", "submitted", "built",
};
G_STATIC_ASSERT (G_N_ELEMENTS (job_status_names) == LAMINA_N_JOB_STATUSES);

G_DEFINE_BOXED_TYPE (LaminaJob, lamina_job, lamina_job_copy, lamina_job_free)

const char *
lamina_job_status_to_string (LaminaJobStatus value)
{
  g_return_val_if_fail ((guint) value < LAMINA_N_JOB_STATUSES, NULL);
  return job_status_names[value];
}

gboolean
lamina_job_status_from_string (const char      *name,
                               LaminaJobStatus *value)
{
  for (guint i = 0; name != NULL && i < G_N_ELEMENTS (job_status_names); i++)
    if (strcmp (job_status_names[i], name) == 0)
      {
        *value = (LaminaJobStatus) i;
        return TRUE;
      }
  return FALSE;
}

/* Entries, junctions, events */

LaminaJobEntry *
lamina_job_entry_new (const char *construction,
                      int         revision,
                      const char *use)
{
  LaminaJobEntry *entry = g_new0 (LaminaJobEntry, 1);

  entry->construction = g_strdup (construction);
  entry->revision = revision;
  entry->use = g_strdup (use);
  entry->area = NAN;
  return entry;
}

LaminaJobEntry *
lamina_job_entry_copy (const LaminaJobEntry *entry)
{
  LaminaJobEntry *copy = g_memdup2 (entry, sizeof *entry);

  copy->construction = g_strdup (entry->construction);
  copy->use = g_strdup (entry->use);
  copy->location = g_strdup (entry->location);
  copy->origin = g_strdup (entry->origin);
  return copy;
}

void
lamina_job_entry_free (LaminaJobEntry *entry)
{
  if (entry == NULL)
    return;
  g_free (entry->construction);
  g_free (entry->use);
  g_free (entry->location);
  g_free (entry->origin);
  g_free (entry);
}

gboolean
lamina_job_entry_is_variant (const LaminaJobEntry *entry)
{
  return entry->origin != NULL;
}

LaminaJobJunction *
lamina_job_junction_new (const char *name,
                         double      psi,
                         double      length)
{
  LaminaJobJunction *junction = g_new0 (LaminaJobJunction, 1);

  junction->name = g_strdup (name);
  junction->psi = psi;
  junction->length = length;
  return junction;
}

LaminaJobJunction *
lamina_job_junction_copy (const LaminaJobJunction *junction)
{
  LaminaJobJunction *copy = g_memdup2 (junction, sizeof *junction);

  copy->name = g_strdup (junction->name);
  return copy;
}

void
lamina_job_junction_free (LaminaJobJunction *junction)
{
  if (junction == NULL)
    return;
  g_free (junction->name);
  g_free (junction);
}

LaminaJobEvent *
lamina_job_event_new (const char *at,
                      const char *by,
                      const char *text)
{
  LaminaJobEvent *event = g_new0 (LaminaJobEvent, 1);

  event->at = g_strdup (at);
  event->by = g_strdup (by);
  event->text = g_strdup (text);
  return event;
}

static LaminaJobEvent *
copy_event (const LaminaJobEvent *event)
{
  return lamina_job_event_new (event->at, event->by, event->text);
}

void
lamina_job_event_free (LaminaJobEvent *event)
{
  if (event == NULL)
    return;
  g_free (event->at);
  g_free (event->by);
  g_free (event->text);
  g_free (event);
}

/* The job */

LaminaJob *
lamina_job_new (const char *id,
                const char *name)
{
  LaminaJob *job = g_new0 (LaminaJob, 1);

  job->id = g_strdup (id);
  job->name = g_strdup (name);
  job->status = LAMINA_JOB_STATUS_DESIGN;
  job->inside_temperature = LAMINA_DEFAULT_INSIDE_TEMPERATURE;
  job->outside_temperature = LAMINA_DEFAULT_OUTSIDE_TEMPERATURE;
  job->ground_area = NAN;
  job->ground_perimeter = NAN;
  job->ground_b_prime = NAN;
  job->entries = g_ptr_array_new_with_free_func ((GDestroyNotify) lamina_job_entry_free);
  job->junctions = g_ptr_array_new_with_free_func ((GDestroyNotify) lamina_job_junction_free);
  job->log = g_ptr_array_new_with_free_func ((GDestroyNotify) lamina_job_event_free);
  return job;
}

LaminaJob *
lamina_job_copy (const LaminaJob *job)
{
  LaminaJob *copy = lamina_job_new (job->id, job->name);

  copy->number = g_strdup (job->number);
  copy->client = g_strdup (job->client);
  copy->site = g_strdup (job->site);
  copy->architect = g_strdup (job->architect);
  copy->status = job->status;
  copy->target_set = g_strdup (job->target_set);
  copy->inside_temperature = job->inside_temperature;
  copy->outside_temperature = job->outside_temperature;
  copy->climate = g_strdup (job->climate);
  copy->ground_area = job->ground_area;
  copy->ground_perimeter = job->ground_perimeter;
  copy->ground_b_prime = job->ground_b_prime;
  copy->notes = g_strdup (job->notes);
  copy->modified_at = g_strdup (job->modified_at);
  copy->line = job->line;
  for (guint i = 0; i < job->entries->len; i++)
    g_ptr_array_add (copy->entries, lamina_job_entry_copy (g_ptr_array_index (job->entries, i)));
  for (guint i = 0; i < job->junctions->len; i++)
    g_ptr_array_add (copy->junctions,
                     lamina_job_junction_copy (g_ptr_array_index (job->junctions, i)));
  for (guint i = 0; i < job->log->len; i++)
    g_ptr_array_add (copy->log, copy_event (g_ptr_array_index (job->log, i)));
  return copy;
}

void
lamina_job_free (LaminaJob *job)
{
  if (job == NULL)
    return;
  g_free (job->id);
  g_free (job->name);
  g_free (job->number);
  g_free (job->client);
  g_free (job->site);
  g_free (job->architect);
  g_free (job->target_set);
  g_free (job->climate);
  g_free (job->notes);
  g_free (job->modified_at);
  g_ptr_array_unref (job->entries);
  g_ptr_array_unref (job->junctions);
  g_ptr_array_unref (job->log);
  g_free (job);
}

static int
next_number (GPtrArray *items)
{
  int n = 0;

  /* Both item types start with their number. */
  for (guint i = 0; i < items->len; i++)
    n = MAX (n, *(const int *) g_ptr_array_index (items, i));
  return n + 1;
}

LaminaJobEntry *
lamina_job_add_entry (LaminaJob      *job,
                      LaminaJobEntry *entry)
{
  g_return_val_if_fail (job != NULL && entry != NULL, NULL);

  entry->n = next_number (job->entries);
  g_ptr_array_add (job->entries, entry);
  return entry;
}

LaminaJobJunction *
lamina_job_add_junction (LaminaJob         *job,
                         LaminaJobJunction *junction)
{
  g_return_val_if_fail (job != NULL && junction != NULL, NULL);

  junction->n = next_number (job->junctions);
  g_ptr_array_add (job->junctions, junction);
  return junction;
}

static int
index_of_number (GPtrArray *items,
                 int        n)
{
  for (guint i = 0; i < items->len; i++)
    if (*(const int *) g_ptr_array_index (items, i) == n)
      return (int) i;
  return -1;
}

LaminaJobEntry *
lamina_job_find_entry (const LaminaJob *job,
                       int              n)
{
  int index = index_of_number (job->entries, n);

  return index < 0 ? NULL : g_ptr_array_index (job->entries, index);
}

static gboolean
remove_number (GPtrArray *items,
               int        n)
{
  int index = index_of_number (items, n);

  if (index < 0)
    return FALSE;
  g_ptr_array_remove_index (items, (guint) index);
  return TRUE;
}

gboolean
lamina_job_remove_entry (LaminaJob *job,
                         int        n)
{
  return remove_number (job->entries, n);
}

gboolean
lamina_job_remove_junction (LaminaJob *job,
                            int        n)
{
  return remove_number (job->junctions, n);
}

void
lamina_job_log (LaminaJob  *job,
                const char *at,
                const char *by,
                const char *text)
{
  g_ptr_array_add (job->log, lamina_job_event_new (at, by, text));
}

gboolean
lamina_job_move_entry (LaminaJob  *job,
                       int         n,
                       int         revision,
                       const char *at,
                       const char *by)
{
  LaminaJobEntry *entry = lamina_job_find_entry (job, n);
  g_autofree char *text = NULL;

  if (entry == NULL || revision < 1)
    return FALSE;
  if (entry->revision == revision)
    return TRUE;
  text = g_strdup_printf (_("entry %d (%s): moved from revision %d to revision %d"),
                          n, entry->construction, entry->revision, revision);
  entry->revision = revision;
  lamina_job_log (job, at, by, text);
  return TRUE;
}

double
lamina_job_get_b_prime (const LaminaJob *job)
{
  if (!isnan (job->ground_b_prime))
    return job->ground_b_prime;
  if (job->ground_area > 0 && job->ground_perimeter > 0)
    return job->ground_area / (0.5 * job->ground_perimeter);
  return NAN;
}

void
lamina_job_apply_conditions (const LaminaJob    *job,
                             LaminaConstruction *c)
{
  c->inside_temperature = job->inside_temperature;
  /* The job's outside design temperature is the outdoor air's: a
   * construction whose outer side faces an adjacent indoor space (a plant
   * room, a garage) keeps the temperature stated for that space. */
  if (c->outer_side != LAMINA_OUTER_SIDE_INDOOR)
    c->outside_temperature = job->outside_temperature;
  if (!c->has_ground)
    return;
  if (job->ground_area > 0 && job->ground_perimeter > 0)
    {
      c->ground.area = job->ground_area;
      c->ground.perimeter = job->ground_perimeter;
    }
  else if (job->ground_b_prime > 0)
    {
      c->ground.area = job->ground_b_prime;
      c->ground.perimeter = 2.0;
    }
}

static gboolean
entry_equal (const LaminaJobEntry *a,
             const LaminaJobEntry *b)
{
  return a->n == b->n
         && g_strcmp0 (a->construction, b->construction) == 0
         && a->revision == b->revision
         && g_strcmp0 (a->use, b->use) == 0
         && g_strcmp0 (a->location, b->location) == 0
         && lamina_same_number (a->area, b->area)
         && g_strcmp0 (a->origin, b->origin) == 0
         && a->origin_revision == b->origin_revision;
}

static gboolean
junction_equal (const LaminaJobJunction *a,
                const LaminaJobJunction *b)
{
  return a->n == b->n && g_strcmp0 (a->name, b->name) == 0
         && lamina_same_number (a->psi, b->psi) && lamina_same_number (a->length, b->length);
}

gboolean
lamina_job_equal (const LaminaJob *a,
                  const LaminaJob *b)
{
  const char *const sa[] = { a->id, a->name, a->number, a->client, a->site, a->architect,
                             a->target_set, a->climate, a->notes };
  const char *const sb[] = { b->id, b->name, b->number, b->client, b->site, b->architect,
                             b->target_set, b->climate, b->notes };
  const double na[] = { a->inside_temperature, a->outside_temperature, a->ground_area,
                        a->ground_perimeter, a->ground_b_prime };
  const double nb[] = { b->inside_temperature, b->outside_temperature, b->ground_area,
                        b->ground_perimeter, b->ground_b_prime };

  for (guint i = 0; i < G_N_ELEMENTS (sa); i++)
    if (g_strcmp0 (sa[i], sb[i]) != 0)
      return FALSE;
  for (guint i = 0; i < G_N_ELEMENTS (na); i++)
    if (!lamina_same_number (na[i], nb[i]))
      return FALSE;
  if (a->status != b->status || a->entries->len != b->entries->len
      || a->junctions->len != b->junctions->len)
    return FALSE;
  for (guint i = 0; i < a->entries->len; i++)
    if (!entry_equal (g_ptr_array_index (a->entries, i), g_ptr_array_index (b->entries, i)))
      return FALSE;
  for (guint i = 0; i < a->junctions->len; i++)
    if (!junction_equal (g_ptr_array_index (a->junctions, i),
                         g_ptr_array_index (b->junctions, i)))
      return FALSE;
  return TRUE;
}

/* Validation */

static gboolean
in_range (double value,
          double min,
          double max)
{
  return value >= min && value <= max;
}

static gboolean
validate_entry (const LaminaJob      *job,
                const LaminaJobEntry *e,
                int                  *line,
                GError              **error)
{
  if (e->n < 1 || lamina_job_find_entry (job, e->n) != e)
    return lamina_refuse_invalid (error, line, e->line, _("job “%s”: entry number %d is not unique"), job->id, e->n);
  if (!lamina_identifier_is_valid (e->construction))
    return lamina_refuse_invalid (error, line, e->line, _("job “%s”, entry %d: the construction id is missing"),
                   job->id, e->n);
  if (e->revision < 1)
    return lamina_refuse_invalid (error, line, e->line, _("job “%s”, entry %d: revision=%d must be 1 or more"),
                   job->id, e->n, e->revision);
  if (!lamina_identifier_is_valid (e->use))
    return lamina_refuse_invalid (error, line, e->line,
                   _("job “%s”, entry %d: the use must be an identifier without blanks"),
                   job->id, e->n);
  if (!isnan (e->area) && !in_range (e->area, 0, 1e6))
    return lamina_refuse_invalid (error, line, e->line,
                   _("job “%s”, entry %d: area=%g is outside the allowed range 0 to 1000000 m²"),
                   job->id, e->n, e->area);
  if ((e->origin != NULL) != (e->origin_revision > 0))
    return lamina_refuse_invalid (error, line, e->line,
                   _("job “%s”, entry %d: a variant names both its origin and the origin's revision"),
                   job->id, e->n);
  return TRUE;
}

static gboolean
validate_junction (const LaminaJob         *job,
                   const LaminaJobJunction *j,
                   int                     *line,
                   GError                 **error)
{
  if (j->n < 1 || index_of_number (job->junctions, j->n) < 0
      || g_ptr_array_index (job->junctions, index_of_number (job->junctions, j->n)) != j)
    return lamina_refuse_invalid (error, line, j->line, _("job “%s”: junction number %d is not unique"),
                   job->id, j->n);
  if (!in_range (j->psi, -10, 10))
    return lamina_refuse_invalid (error, line, j->line,
                   _("job “%s”, junction %d: ψ=%g is outside the allowed range −10 to 10 W/(m·K)"),
                   job->id, j->n, j->psi);
  if (!in_range (j->length, 0, 1e5))
    return lamina_refuse_invalid (error, line, j->line,
                   _("job “%s”, junction %d: length=%g is outside the allowed range 0 to 100000 m"),
                   job->id, j->n, j->length);
  return TRUE;
}

gboolean
lamina_job_validate (const LaminaJob *job,
                     int             *line,
                     GError         **error)
{
  g_return_val_if_fail (job != NULL, FALSE);

  if (line != NULL)
    *line = 0;
  if (!lamina_identifier_is_valid (job->id))
    return lamina_refuse_invalid (error, line, job->line, _("job: the id must be 1 to 200 characters without blanks"));
  if (job->name == NULL || job->name[0] == '\0')
    return lamina_refuse_invalid (error, line, job->line, _("job “%s”: the name is missing"), job->id);
  if (!in_range (job->inside_temperature, -80, 80) || !in_range (job->outside_temperature, -80, 80))
    return lamina_refuse_invalid (error, line, job->line,
                   _("job “%s”: the design temperatures must be from −80 to 80 °C"), job->id);
  if (job->target_set != NULL && !lamina_identifier_is_valid (job->target_set))
    return lamina_refuse_invalid (error, line, job->line, _("job “%s”: the target set id is not an identifier"),
                   job->id);
  for (guint i = 0; i < 3; i++)
    {
      const double v[] = { job->ground_area, job->ground_perimeter, job->ground_b_prime };

      if (!isnan (v[i]) && !in_range (v[i], 1e-3, 1e6))
        return lamina_refuse_invalid (error, line, job->line,
                       _("job “%s”: the ground floor's %s=%g must be above 0 and at most 1000000"),
                       job->id, (const char *[]) { "ground-area", "ground-perimeter", "ground-b-prime" }[i],
                       v[i]);
    }
  for (guint i = 0; i < job->entries->len; i++)
    if (!validate_entry (job, g_ptr_array_index (job->entries, i), line, error))
      return FALSE;
  for (guint i = 0; i < job->junctions->len; i++)
    if (!validate_junction (job, g_ptr_array_index (job->junctions, i), line, error))
      return FALSE;
  return TRUE;
}
