/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-library-review.c: what an approval means.  The review policy
 * (four eyes by default), approving only what was checked, an approval
 * date not before the modification, the method's scope (a 2-D check or a
 * written reason), and every act kept as a record. */
#define G_LOG_DOMAIN "lamina-store"

#include "lamina-library.h"

#include <glib/gi18n-lib.h>
#include <stdio.h>
#include <string.h>

#include "lamina-library-backend.h"

#define POLICY_KEY "review-policy"

static const char *const policy_names[] = { "four-eyes", "single" };

const char *
lamina_review_policy_to_string (LaminaReviewPolicy policy)
{
  g_return_val_if_fail ((guint) policy < G_N_ELEMENTS (policy_names), NULL);
  return policy_names[policy];
}

gboolean
lamina_review_policy_from_string (const char         *text,
                                  LaminaReviewPolicy *policy)
{
  for (guint i = 0; text != NULL && i < G_N_ELEMENTS (policy_names); i++)
    if (g_ascii_strcasecmp (text, policy_names[i]) == 0)
      {
        *policy = (LaminaReviewPolicy) i;
        return TRUE;
      }
  return FALSE;
}

const char *
lamina_review_policy_describe (LaminaReviewPolicy policy)
{
  return policy == LAMINA_REVIEW_SINGLE
    ? _("single reviewer: the author may check and approve (a one-person practice)")
    : _("four eyes: checked and approved by others than the author");
}

const char *
lamina_review_policy_explain (LaminaReviewPolicy policy)
{
  return policy == LAMINA_REVIEW_SINGLE
    ? _("the author may check and approve (a one-person practice)")
    : _("checked and approved by others than the author");
}

void
lamina_review_event_free (LaminaReviewEvent *event)
{
  if (event == NULL)
    return;
  g_free (event->act);
  g_free (event->by);
  g_free (event->at);
  g_free (event->date);
  g_free (event->policy);
  g_free (event->reason);
  g_free (event);
}

LaminaReviewPolicy
lamina_library_get_review_policy (LaminaLibrary *self)
{
  g_autofree char *value = NULL;
  LaminaReviewPolicy policy = LAMINA_REVIEW_FOUR_EYES;

  g_return_val_if_fail (LAMINA_IS_LIBRARY (self), LAMINA_REVIEW_FOUR_EYES);
  if (BE (self) == NULL)
    return LAMINA_REVIEW_FOUR_EYES;
  value = VT (self)->get_setting (BE (self), POLICY_KEY, NULL);
  /* Anything unknown is read as the strict default. */
  if (value == NULL || !lamina_review_policy_from_string (value, &policy))
    return LAMINA_REVIEW_FOUR_EYES;
  return policy;
}

gboolean
lamina_library_set_review_policy (LaminaLibrary      *self,
                                  LaminaReviewPolicy  policy,
                                  GError            **error)
{
  g_return_val_if_fail (LAMINA_IS_LIBRARY (self), FALSE);
  g_return_val_if_fail ((guint) policy < G_N_ELEMENTS (policy_names), FALSE);
  BACKEND_OR_FAIL (self, error, FALSE);
  if (!VT (self)->set_setting (BE (self), POLICY_KEY, policy_names[policy], error))
    return FALSE;
  lamina_library_emit_changed (self);
  return TRUE;
}

GPtrArray *
lamina_library_dup_review_events (LaminaLibrary  *self,
                                  const char     *id,
                                  GError        **error)
{
  g_return_val_if_fail (LAMINA_IS_LIBRARY (self), NULL);
  g_return_val_if_fail (id != NULL, NULL);
  BACKEND_OR_FAIL (self, error, NULL);
  return VT (self)->get_review_events (BE (self), id, error);
}

/* Two names for one person: NFC, case-folded, blanks trimmed. */
gboolean
lamina_library_same_person (const char *a,
             const char *b)
{
  g_autofree char *na = NULL, *nb = NULL, *fa = NULL, *fb = NULL;

  if (a == NULL || b == NULL)
    return FALSE;
  na = g_utf8_normalize (a, -1, G_NORMALIZE_NFC);
  nb = g_utf8_normalize (b, -1, G_NORMALIZE_NFC);
  if (na == NULL || nb == NULL)
    return FALSE;
  fa = g_utf8_casefold (g_strstrip (na), -1);
  fb = g_utf8_casefold (g_strstrip (nb), -1);
  return strcmp (fa, fb) == 0;
}

static gboolean
valid_date (const char *date)
{
  int y, m, d;
  char tail;

  return strlen (date) == 10 && sscanf (date, "%4d-%2d-%2d%c", &y, &m, &d, &tail) == 3
         && g_date_valid_dmy (d, m, y);
}

/* The rules that need the revision itself: who wrote it, when, and
 * whether its result is within the method's scope. */
static gboolean
check_revision (LaminaLibrary             *self,
                LaminaBackendReview       *r,
                LaminaReviewPolicy         policy,
                GError                   **error)
{
  g_autoptr(LaminaConstruction) c = VT (self)->get_construction (BE (self), r->id, 0, error);
  g_autoptr(LaminaResult) result = NULL;
  const char *label;

  if (c == NULL)
    return FALSE;
  label = c->code ? c->code : c->id;
  /* --revision N: the revision on the reviewer's screen must still be the
   * latest (checked again inside the backend's transaction). */
  if (r->revision > 0 && r->revision != c->revision)
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_STALE,
                   "%s: revision %d is not the latest (%d); review the latest revision",
                   label, r->revision, c->revision);
      return FALSE;
    }
  if (r->act != LAMINA_REVIEW_ACT_WITHDRAW && policy == LAMINA_REVIEW_FOUR_EYES
      && lamina_library_same_person (r->by, c->modified_by))
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_POLICY,
                   r->act == LAMINA_REVIEW_ACT_CHECK
                   ? "%s revision %d: %s wrote this revision and cannot check it (the library's "
                     "review policy is four eyes; see “lamina-cli policy”)"
                   : "%s revision %d: %s wrote this revision and cannot approve it (the library's "
                     "review policy is four eyes; see “lamina-cli policy”)",
                   label, c->revision, r->by);
      return FALSE;
    }
  if (r->act != LAMINA_REVIEW_ACT_APPROVE)
    return TRUE;
  if (c->modified_at != NULL && strncmp (r->date, c->modified_at, 10) < 0)
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_INVALID,
                   "approval date %s: before revision %d of %s was made (%.10s)",
                   r->date, c->revision, label, c->modified_at);
      return FALSE;
    }
  result = lamina_calculate (c, NULL);
  /* Hook for the 2-D check (EN ISO 10211): a stored check of this very
   * revision answers for the method-limit warnings; without one, a
   * written reason is needed and kept with the approval. */
  if (result == NULL || !lamina_field_is_advised (result)
      || lamina_library_has_field_check (self, r->id, c->revision))
    {
      /* Within the scope (or answered by a 2-D check): no override to
       * record, and none to print. */
      r->reason = NULL;
      return TRUE;
    }
  if (r->reason == NULL)
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_SCOPE,
                   "%s revision %d is outside the scope of EN ISO 6946 (metal bridging insulation "
                   "or R'T/R''T above 1.5): approve it after a 2-D check to EN ISO 10211, or give "
                   "the reason for approving it on this result (--reason)", label, c->revision);
      return FALSE;
    }
  return TRUE;
}

/* A name, id or code as recorded: NFC, blanks trimmed, and no control or
 * format characters (bidi overrides, zero-width characters, newlines,
 * escape codes, line separators) that would make two look alike or
 * rewrite a terminal line.  @field names it in the message. */
char *
lamina_library_dup_clean_identity (const char  *value,
                                   const char  *field,
                                   GError     **error)
{
  g_autofree char *nfc = NULL;
  glong position = 1;

  if (!g_utf8_validate (value, -1, NULL) || (nfc = g_utf8_normalize (value, -1, G_NORMALIZE_NFC)) == NULL)
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_INVALID,
                   "%s: not valid UTF-8", field);
      return NULL;
    }
  for (const char *p = nfc; *p; p = g_utf8_next_char (p), position++)
    {
      gunichar ch = g_utf8_get_char (p);
      GUnicodeType type = g_unichar_type (ch);

      if (type == G_UNICODE_CONTROL || type == G_UNICODE_FORMAT
          || type == G_UNICODE_LINE_SEPARATOR || type == G_UNICODE_PARAGRAPH_SEPARATOR)
        {
          g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_INVALID,
                       "%s: character %ld is U+%04X, a control or invisible formatting "
                       "character; type it in plain letters", field, position, ch);
          return NULL;
        }
    }
  return g_strstrip (g_steal_pointer (&nfc));
}

static gboolean
record (LaminaLibrary       *self,
        LaminaBackendReview *r,
        GError             **error)
{
  g_autofree char *trimmed = lamina_library_dup_clean_identity (r->by ? r->by : "", "reviewer name (--by)", error);
  g_autofree char *now = lamina_library_dup_now ();
  g_autofree char *reason = r->reason ? g_strstrip (g_strdup (r->reason)) : NULL;
  LaminaReviewPolicy policy;

  if (trimmed == NULL)
    return FALSE;
  BACKEND_OR_FAIL (self, error, FALSE);
  if (*trimmed == '\0')
    {
      g_set_error_literal (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_INVALID,
                           "reviewer name (--by): required");
      return FALSE;
    }
  if (r->act == LAMINA_REVIEW_ACT_WITHDRAW && (reason == NULL || *reason == '\0'))
    {
      g_set_error_literal (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_INVALID,
                           "reason (--reason): required to withdraw an approval");
      return FALSE;
    }
  policy = lamina_library_get_review_policy (self);
  r->by = trimmed;
  r->at = now;
  r->policy = lamina_review_policy_to_string (policy);
  r->reason = reason != NULL && *reason != '\0' ? reason : NULL;
  if (!check_revision (self, r, policy, error) || !VT (self)->review (BE (self), r, error))
    return FALSE;
  lamina_library_emit_changed (self);
  return TRUE;
}

gboolean
lamina_library_mark_checked (LaminaLibrary  *self,
                             const char     *id,
                             int             revision,
                             const char     *name,
                             GError        **error)
{
  LaminaBackendReview r = { id, revision, LAMINA_REVIEW_ACT_CHECK, name, NULL, NULL, NULL, NULL };

  g_return_val_if_fail (LAMINA_IS_LIBRARY (self), FALSE);
  g_return_val_if_fail (id != NULL, FALSE);
  return record (self, &r, error);
}

gboolean
lamina_library_approve_with_reason (LaminaLibrary  *self,
                                    const char     *id,
                                    int             revision,
                                    const char     *name,
                                    const char     *date,
                                    const char     *reason,
                                    GError        **error)
{
  LaminaBackendReview r = { id, revision, LAMINA_REVIEW_ACT_APPROVE, name, NULL, date, NULL, reason };
  g_autofree char *today = NULL;

  g_return_val_if_fail (LAMINA_IS_LIBRARY (self), FALSE);
  g_return_val_if_fail (id != NULL, FALSE);

  if (date == NULL)
    {
      g_autoptr(GDateTime) now = g_date_time_new_now_utc ();

      r.date = today = g_date_time_format (now, "%Y-%m-%d");
    }
  else if (!valid_date (date))
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_INVALID,
                   "approval date “%s”: expected YYYY-MM-DD", date);
      return FALSE;
    }
  return record (self, &r, error);
}

gboolean
lamina_library_approve (LaminaLibrary  *self,
                        const char     *id,
                        int             revision,
                        const char     *name,
                        const char     *date,
                        GError        **error)
{
  return lamina_library_approve_with_reason (self, id, revision, name, date, NULL, error);
}

gboolean
lamina_library_withdraw_approval (LaminaLibrary  *self,
                                  const char     *id,
                                  int             revision,
                                  const char     *name,
                                  const char     *reason,
                                  GError        **error)
{
  LaminaBackendReview r = { id, revision, LAMINA_REVIEW_ACT_WITHDRAW, name, NULL, NULL, NULL, reason };

  g_return_val_if_fail (LAMINA_IS_LIBRARY (self), FALSE);
  g_return_val_if_fail (id != NULL, FALSE);
  return record (self, &r, error);
}

