/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-library-safety.c: read-only libraries, waiting for a busy one,
 * the messages of refused writes and damaged files, and verification. */
#define G_LOG_DOMAIN "lamina-store"

#include "config.h"

#include "lamina-library-safety.h"

#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "lamina-library-backend.h"

#define DEFAULT_BUSY_TIMEOUT 60.0

gboolean
lamina_library_is_read_only (LaminaLibrary *self)
{
  return lamina_library_get_read_only_reason (self) != NULL;
}

const char *
lamina_library_get_read_only_reason (LaminaLibrary *self)
{
  g_return_val_if_fail (LAMINA_IS_LIBRARY (self), NULL);
  return BE (self) ? BE (self)->read_only_reason : NULL;
}

gboolean
lamina_library_check_writable (LaminaLibrary  *self,
                               GError        **error)
{
  g_return_val_if_fail (LAMINA_IS_LIBRARY (self), FALSE);
  BACKEND_OR_FAIL (self, error, FALSE);
  if (BE (self)->read_only_reason == NULL)
    return TRUE;
  lamina_backend_set_read_only_error (BE (self), error);
  return FALSE;
}

void
lamina_backend_set_read_only_error (LaminaBackend  *backend,
                                    GError        **error)
{
  g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_READ_ONLY,
               "%s: the library is read-only (%s); nothing was changed",
               backend->path,
               backend->read_only_reason ? backend->read_only_reason
                                         : "the file cannot be written");
}

void
lamina_backend_set_damaged_error (LaminaBackend  *backend,
                                  const char     *where,
                                  const char     *detail,
                                  GError        **error)
{
  g_autofree char *latest = lamina_backup_dup_latest_for_path (backend->path);
  g_autofree char *dir = NULL;
  g_autofree char *about_backup = NULL;
  g_autofree char *line = g_strdup (detail);
  char *start = line;

  /* SQLite's check answers in lines, under a heading. */
  g_strdelimit (line, "\n", ' ');
  if (g_str_has_prefix (start, "*** in database main *** "))
    start += strlen ("*** in database main *** ");
  if (latest != NULL)
    about_backup = g_strdup_printf ("the last good backup is %s "
                                    "(“lamina-cli restore” brings it back)", latest);
  else
    {
      dir = lamina_backup_dup_dir_for_path (backend->path);
      about_backup = g_strdup_printf ("no backup of it was found in %s", dir);
    }
  g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_CORRUPT,
               "%s is damaged (found %s: %s); %s; the file was not changed",
               backend->path, where, start, about_backup);
}

/* ---- Waiting for another program ------------------------------------- */

/* lamina_library_set_wait_func is in lamina-library.c, beside the
 * library's fields it keeps. */

double
lamina_backend_default_busy_timeout (void)
{
  const char *env = g_getenv ("LAMINA_BUSY_TIMEOUT");
  char *end = NULL;
  double seconds;

  if (env == NULL || *env == '\0')
    return DEFAULT_BUSY_TIMEOUT;
  seconds = g_ascii_strtod (env, &end);
  if (end == env || *end != '\0' || !isfinite (seconds) || seconds < 0 || seconds > 86400)
    {
      g_warning ("LAMINA_BUSY_TIMEOUT: “%s” is not a number of seconds from 0 to 86400; "
                 "waiting %g s", env, DEFAULT_BUSY_TIMEOUT);
      return DEFAULT_BUSY_TIMEOUT;
    }
  return seconds;
}

void
lamina_library_set_busy_timeout (LaminaLibrary *self,
                                 double         seconds)
{
  g_return_if_fail (LAMINA_IS_LIBRARY (self));
  g_return_if_fail (seconds >= 0);
  if (BE (self) != NULL)
    BE (self)->busy_timeout = seconds;
}

double
lamina_library_get_busy_timeout (LaminaLibrary *self)
{
  g_return_val_if_fail (LAMINA_IS_LIBRARY (self), 0);
  return BE (self) ? BE (self)->busy_timeout : 0;
}

gboolean
lamina_library_wait_until_writable (LaminaLibrary  *self,
                                    double          seconds,
                                    GCancellable   *cancellable,
                                    GError        **error)
{
  gint64 start = g_get_monotonic_time ();
  double timeout;
  gboolean ok = FALSE;

  g_return_val_if_fail (LAMINA_IS_LIBRARY (self), FALSE);
  g_return_val_if_fail (seconds >= 0, FALSE);
  BACKEND_OR_FAIL (self, error, FALSE);

  if (VT (self)->probe_write == NULL)
    return TRUE;
  /* Steps of a second: the busy handler cannot look at @cancellable. */
  timeout = BE (self)->busy_timeout;
  BE (self)->busy_timeout = 1.0;
  for (;;)
    {
      g_autoptr(GError) local = NULL;

      if (g_cancellable_set_error_if_cancelled (cancellable, error))
        break;
      if (VT (self)->probe_write (BE (self), &local))
        {
          ok = TRUE;
          break;
        }
      if (!g_error_matches (local, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_BUSY)
          || (seconds > 0 && g_get_monotonic_time () - start >= seconds * G_USEC_PER_SEC))
        {
          g_propagate_error (error, g_steal_pointer (&local));
          break;
        }
    }
  BE (self)->busy_timeout = timeout;
  return ok;
}

/* ---- Verification ----------------------------------------------------- */

void
lamina_verify_report_free (LaminaVerifyReport *report)
{
  if (report == NULL)
    return;
  g_ptr_array_unref (report->problems);
  g_free (report);
}

G_GNUC_PRINTF (2, 3) static void
problem (LaminaVerifyReport *report,
         const char         *format,
         ...)
{
  va_list args;

  va_start (args, format);
  g_ptr_array_add (report->problems, g_strdup_vprintf (format, args));
  va_end (args);
}

static const char *
label_of (const char *id,
          const char *code)
{
  return code != NULL && *code != '\0' ? code : id;
}

/* The figures stored with an approved revision against its build-up
 * recalculated now (the method is deterministic; 0.00005 W/(m²·K) leaves
 * room for the stored number's rounding, nothing else). */
static void
verify_figures (LaminaLibrary       *self,
                LaminaVerifyReport  *report,
                const char          *id,
                const char          *label,
                LaminaRevisionInfo  *info)
{
  g_autoptr(GError) error = NULL;
  g_autoptr(LaminaConstruction) c = VT (self)->get_construction (BE (self), id, info->revision,
                                                                  &error);
  g_autoptr(LaminaResult) result = NULL;

  report->n_approved++;
  if (c == NULL)
    {
      problem (report, "%s revision %d (approved): cannot be read: %s",
               label, info->revision, error->message);
      return;
    }
  result = lamina_calculate (c, NULL);
  if (result == NULL && !isnan (info->u_corrected))
    problem (report, "%s revision %d (approved): a stored U of %.4f W/(m²·K) but its "
             "build-up cannot be calculated", label, info->revision, info->u_corrected);
  else if (result != NULL && isnan (info->u_corrected))
    problem (report, "%s revision %d (approved): no stored U, but its build-up gives "
             "%.4f W/(m²·K)", label, info->revision, result->u_corrected);
  else if (result != NULL && fabs (result->u_corrected - info->u_corrected) > 0.00005)
    problem (report, "%s revision %d (approved): the stored U %.4f W/(m²·K) differs from "
             "its build-up recalculated now, %.4f W/(m²·K): the stored figure was changed, "
             "or it was calculated by an earlier version of the method",
             label, info->revision, info->u_corrected, result->u_corrected);
}

static LaminaRevisionInfo *
find_revision (GPtrArray *history,
               int        revision)
{
  for (guint i = 0; i < history->len; i++)
    if (((LaminaRevisionInfo *) history->pdata[i])->revision == revision)
      return history->pdata[i];
  return NULL;
}

static void
verify_review (LaminaVerifyReport *report,
               const char         *label,
               GPtrArray          *history,
               GPtrArray          *events)
{
  for (guint i = 0; i < history->len; i++)
    {
      LaminaRevisionInfo *info = history->pdata[i];

      if (info->status == LAMINA_STATUS_APPROVED
          && (info->approved_by == NULL || *info->approved_by == '\0'
              || info->approved_at == NULL || info->checked_by == NULL
              || *info->checked_by == '\0'))
        problem (report, "%s revision %d: approved, but the record does not name %s",
                 label, info->revision,
                 info->checked_by == NULL || *info->checked_by == '\0'
                   ? "who checked it" : "who approved it and when");
      if (info->status == LAMINA_STATUS_CHECKED
          && (info->checked_by == NULL || *info->checked_by == '\0'))
        problem (report, "%s revision %d: checked, but the record does not name who checked it",
                 label, info->revision);
      if (info->status != LAMINA_STATUS_APPROVED && info->approved_by != NULL)
        problem (report, "%s revision %d: %s, but an approver (%s) is recorded",
                 label, info->revision, lamina_status_to_string (info->status),
                 info->approved_by);
      if (info->approved_at != NULL && info->modified_at != NULL
          && strncmp (info->approved_at, info->modified_at, 10) < 0)
        problem (report, "%s revision %d: approved on %s, before it was modified (%.10s)",
                 label, info->revision, info->approved_at, info->modified_at);
    }
  for (guint i = 0; events != NULL && i < events->len; i++)
    {
      LaminaReviewEvent *e = events->pdata[i];
      LaminaRevisionInfo *info = find_revision (history, e->revision);

      report->n_reviews++;
      if (info == NULL)
        {
          problem (report, "%s: a review record (%s by %s) names revision %d, which does not exist",
                   label, e->act, e->by, e->revision);
          continue;
        }
      if (g_strcmp0 (e->act, "approved") == 0 && g_strcmp0 (e->policy, "four-eyes") == 0
          && lamina_library_same_person (e->by, info->modified_by))
        problem (report, "%s revision %d: approved by its author %s under the four-eyes policy",
                 label, e->revision, e->by);
      if (g_strcmp0 (e->act, "checked") == 0 && g_strcmp0 (e->policy, "four-eyes") == 0
          && lamina_library_same_person (e->by, info->modified_by))
        problem (report, "%s revision %d: checked by its author %s under the four-eyes policy",
                 label, e->revision, e->by);
    }
  /* The last act on a revision decides its status. */
  for (guint i = 0; events != NULL && i < history->len; i++)
    {
      LaminaRevisionInfo *info = history->pdata[i];
      const char *last = NULL;

      for (guint k = 0; k < events->len; k++)
        {
          LaminaReviewEvent *e = events->pdata[k];

          if (e->revision == info->revision)
            last = e->act;
        }
      if (last == NULL)
        continue;
      if ((g_strcmp0 (last, "approved") == 0) != (info->status == LAMINA_STATUS_APPROVED))
        problem (report, "%s revision %d: its last review record says “%s” but the revision "
                 "is %s", label, info->revision, last, lamina_status_to_string (info->status));
    }
}

/* An id or code stored before such values were cleaned as they came in
 * (NFC, no control or format characters): the library still opens and
 * works, and verify says what a look-alike could be mistaken for. */
/* @value with each control or format character shown as <U+XXXX>, so
 * that printing it cannot rewrite a terminal line. */
static char *
dup_printable (const char *value)
{
  g_autofree char *valid = g_utf8_make_valid (value, -1);
  GString *out = g_string_new (NULL);

  for (const char *p = valid; *p; p = g_utf8_next_char (p))
    {
      gunichar ch = g_utf8_get_char (p);
      GUnicodeType type = g_unichar_type (ch);

      if (type == G_UNICODE_CONTROL || type == G_UNICODE_FORMAT
          || type == G_UNICODE_LINE_SEPARATOR || type == G_UNICODE_PARAGRAPH_SEPARATOR)
        g_string_append_printf (out, "<U+%04X>", ch);
      else
        g_string_append_unichar (out, ch);
    }
  return g_string_free (out, FALSE);
}

static void
verify_identity (LaminaVerifyReport *report,
                 const char         *what,
                 const char         *field,
                 const char         *value)
{
  g_autoptr(GError) e = NULL;
  g_autofree char *clean = NULL;
  g_autofree char *shown = NULL;

  if (value == NULL)
    return;
  clean = lamina_library_dup_clean_identity (value, field, &e);
  shown = dup_printable (value);
  if (clean == NULL)
    problem (report, "%s “%s”: %s", what, shown, e->message);
  else if (strcmp (clean, value) != 0)
    problem (report, "%s “%s”: its %s is not in Unicode normalization form C (NFC) or has "
             "blanks at its ends, so the same text typed again does not find it; it still "
             "works as stored", what, shown, field);
}

static void
verify_material_ids (LaminaLibrary      *self,
                     LaminaVerifyReport *report)
{
  g_autoptr(GError) e = NULL;
  g_autoptr(GPtrArray) materials = VT (self)->list_materials (BE (self), &e);

  if (materials == NULL)
    {
      problem (report, "the list of materials cannot be read: %s", e->message);
      return;
    }
  for (guint i = 0; i < materials->len; i++)
    verify_identity (report, "material", "id", ((LaminaMaterial *) materials->pdata[i])->id);
}

LaminaVerifyReport *
lamina_library_verify (LaminaLibrary  *self,
                       GError        **error)
{
  g_autoptr(LaminaVerifyReport) report = g_new0 (LaminaVerifyReport, 1);
  g_autoptr(GPtrArray) ids = NULL;
  g_autoptr(GError) local = NULL;

  g_return_val_if_fail (LAMINA_IS_LIBRARY (self), NULL);
  BACKEND_OR_FAIL (self, error, NULL);

  report->problems = g_ptr_array_new_with_free_func (g_free);
  if (VT (self)->verify_storage != NULL)
    {
      if (!VT (self)->verify_storage (BE (self), report->problems, error))
        return NULL;
      report->storage_checked = TRUE;
    }
  verify_material_ids (self, report);
  ids = VT (self)->list_ids (BE (self), &local);
  if (ids == NULL)
    {
      problem (report, "the list of constructions cannot be read: %s", local->message);
      return g_steal_pointer (&report);
    }
  for (guint i = 0; i < ids->len; i++)
    {
      const char *id = ids->pdata[i];
      g_autoptr(GPtrArray) history = NULL;
      g_autoptr(GPtrArray) events = NULL;
      g_autoptr(LaminaConstruction) head = NULL;
      g_autoptr(GError) e = NULL;
      const char *label;

      report->n_constructions++;
      verify_identity (report, "construction", "id", id);
      head = VT (self)->get_construction (BE (self), id, 0, &e);
      if (head == NULL)
        {
          problem (report, "construction %s cannot be read: %s", id, e->message);
          continue;
        }
      verify_identity (report, "construction", "code", head->code);
      label = label_of (id, head->code);
      history = VT (self)->get_history (BE (self), id, &e);
      if (history == NULL)
        {
          problem (report, "%s: its history cannot be read: %s", label, e->message);
          continue;
        }
      events = VT (self)->get_review_events (BE (self), id, &e);
      if (events == NULL)
        {
          problem (report, "%s: its review records cannot be read: %s", label, e->message);
          g_clear_error (&e);
        }
      for (guint k = 0; k < history->len; k++)
        {
          LaminaRevisionInfo *info = history->pdata[k];

          if (info->status == LAMINA_STATUS_APPROVED)
            verify_figures (self, report, id, label, info);
        }
      verify_review (report, label, history, events);
    }
  return g_steal_pointer (&report);
}
