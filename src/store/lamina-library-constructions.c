/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-library-constructions.c: construction revisions, review and
 * search through LaminaLibrary. */
#define G_LOG_DOMAIN "lamina-store"

#include "lamina-library.h"

#include <glib/gi18n-lib.h>
#include <stdio.h>

#include "lamina-library-backend.h"
#include "lamina-store-common.h"

gboolean
lamina_library_prepare_revision (LaminaConstruction  *c,
                                 LaminaResult       **result,
                                 char               **calc_error)
{
  g_autoptr(GError) local = NULL;

  *result = lamina_calculate (c, &local);
  *calc_error = local ? g_strdup (local->message) : NULL;
  return *result != NULL;
}

void
lamina_library_set_new_draft (LaminaConstruction *c,
               int                 revision,
               const char         *author)
{
  c->revision = revision;
  c->status = LAMINA_STATUS_DRAFT;
  g_clear_pointer (&c->checked_by, g_free);
  g_clear_pointer (&c->checked_at, g_free);
  g_clear_pointer (&c->approved_by, g_free);
  g_clear_pointer (&c->approved_at, g_free);
  /* A record of another library describes the content it came with. */
  g_clear_pointer (&c->source_review, g_free);
  g_free (c->modified_by);
  c->modified_by = g_strdup (lamina_library_default_author (author));
  g_free (c->modified_at);
  c->modified_at = lamina_library_dup_now ();
  g_free (c->draft_stamp);
  c->draft_stamp = g_uuid_string_random ();
}

/* A moisture check carries the data of its climate: the library's, when it
 * has none yet or names another climate now (EN ISO 13788). */
static gboolean
resolve_climate (LaminaLibrary       *self,
                 LaminaConstruction  *c,
                 GError             **error)
{
  LaminaMoistureSettings *m = c->moisture;
  g_autoptr(GError) local = NULL;
  LaminaClimate *climate;

  if (m == NULL || (m->climate_data != NULL && g_strcmp0 (m->climate_data->id, m->climate) == 0))
    return TRUE;
  climate = VT (self)->get_climate (BE (self), m->climate ? m->climate : "", &local);
  if (climate == NULL)
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_INVALID,
                   "moisture check: %s", local->message);
      return FALSE;
    }
  lamina_climate_free (m->climate_data);
  m->climate_data = climate;
  return TRUE;
}

gboolean
lamina_library_clean_material_identity (LaminaMaterial  *m,
                                        const char      *where,
                                        GError         **error)
{
  g_autoptr(GError) local = NULL;
  char *clean;

  if (m->id == NULL)
    return TRUE;
  if ((clean = lamina_library_dup_clean_identity (m->id, "id", &local)) == NULL)
    goto fail;
  g_free (m->id);
  m->id = clean;
  if (*m->id != '\0')
    return TRUE;
  g_set_error_literal (&local, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_INVALID, "id: empty");
fail:
  if (where != NULL)
    g_propagate_prefixed_error (error, g_steal_pointer (&local), "%s: ", where);
  else
    g_propagate_prefixed_error (error, g_steal_pointer (&local), "material “%s”, ",
                                m->name ? m->name : "");
  return FALSE;
}

static void
normalize_material_id (LaminaMaterial *m)
{
  char *nfc;

  if (m == NULL || m->id == NULL || !g_utf8_validate (m->id, -1, NULL)
      || (nfc = g_utf8_normalize (m->id, -1, G_NORMALIZE_NFC)) == NULL)
    return;
  g_free (m->id);
  m->id = nfc;
}

void
lamina_library_normalize_layer_material_ids (LaminaConstruction *c)
{
  for (guint i = 0; c->layers != NULL && i < c->layers->len; i++)
    {
      LaminaLayer *layer = c->layers->pdata[i];

      normalize_material_id (layer->material);
      for (guint k = 0; layer->parts != NULL && k < layer->parts->len; k++)
        normalize_material_id (((LaminaPart *) layer->parts->pdata[k])->material);
    }
}

gboolean
lamina_library_clean_construction_identity (LaminaConstruction  *c,
                                            gboolean             new_id,
                                            const char          *where,
                                            GError             **error)
{
  g_autoptr(GError) local = NULL;
  char *clean;

  if (new_id && c->id != NULL)
    {
      if ((clean = lamina_library_dup_clean_identity (c->id, "id", &local)) == NULL)
        goto fail;
      g_free (c->id);
      c->id = clean;
      if (*c->id == '\0')
        {
          g_set_error_literal (&local, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_INVALID,
                               "id: empty");
          goto fail;
        }
    }
  if (c->code != NULL)
    {
      if ((clean = lamina_library_dup_clean_identity (c->code, "code", &local)) == NULL)
        goto fail;
      g_free (c->code);
      c->code = clean;
      if (*c->code == '\0')
        g_clear_pointer (&c->code, g_free);
    }
  return TRUE;
fail:
  if (where != NULL)
    g_propagate_prefixed_error (error, g_steal_pointer (&local), "%s: ", where);
  else
    g_propagate_prefixed_error (error, g_steal_pointer (&local), "construction ");
  return FALSE;
}

char *
lamina_library_dup_code_user (LaminaLibrary *self,
                              const char    *code,
                              const char    *except_id,
                              GError       **error)
{
  if (code == NULL || VT (self)->find_code == NULL)
    return NULL;
  return VT (self)->find_code (BE (self), code, except_id, error);
}

/* Office codes are unique within a library: a second "EW-101" is
 * refused, naming the construction that has it. */
static gboolean
check_code_free (LaminaLibrary             *self,
                 const LaminaConstruction  *c,
                 GError                   **error)
{
  g_autoptr(GError) local = NULL;
  g_autofree char *other = lamina_library_dup_code_user (self, c->code, c->id, &local);
  g_autoptr(LaminaConstruction) user = NULL;

  /* An early check, before the write's own transaction, to name the
   * other construction before anything is calculated: a library busy or
   * still being created by another program is not a reason to refuse the
   * save.  The backend checks again inside the write's transaction
   * (store_revision), where no concurrent writer can slip in between. */
  if (local != NULL)
    g_debug ("office code check skipped: %s", local->message);
  if (other == NULL)
    return TRUE;
  user = VT (self)->get_construction (BE (self), other, 0, NULL);
  lamina_store_set_code_used_error (error, c->code, user && user->name ? user->name : other);
  return FALSE;
}

/* @in_place (the stamp of the state it replaces): @c replaces the head
 * draft of the same number (see draft_after_approval) instead of going on
 * top of @base. */
static gboolean
store (LaminaLibrary       *self,
       LaminaConstruction  *c,
       int                  base,
       const char          *comment,
       const char          *in_place,
       GError             **error)
{
  g_autoptr(LaminaResult) result = NULL;
  g_autofree char *calc_error = NULL;
  LaminaBackendRevision rev = { c, NULL, NULL, comment };

  if (c->name == NULL || *c->name == '\0')
    {
      g_set_error_literal (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_INVALID,
                           "construction name: required");
      return FALSE;
    }
  /* A new construction's id is cleaned too; an existing one is looked up
   * as stored. */
  if (!lamina_library_clean_construction_identity (c, base == 0 && !in_place, NULL, error)
      || !resolve_climate (self, c, error)
      || !check_code_free (self, c, error))
    return FALSE;
  lamina_library_prepare_revision (c, &result, &calc_error);
  rev.result = result;
  rev.calc_error = calc_error;
  if (in_place ? !VT (self)->replace_draft (BE (self), &rev, in_place, error)
               : !VT (self)->store_revision (BE (self), &rev, base, error))
    return FALSE;
  lamina_library_emit_changed (self);
  return TRUE;
}

LaminaConstruction *
lamina_library_dup_construction (LaminaLibrary  *self,
                                 const char     *id,
                                 int             revision,
                                 GError        **error)
{
  g_return_val_if_fail (LAMINA_IS_LIBRARY (self), NULL);
  g_return_val_if_fail (id != NULL, NULL);
  BACKEND_OR_FAIL (self, error, NULL);
  return VT (self)->get_construction (BE (self), id, revision, error);
}

LaminaResult *
lamina_library_dup_result (LaminaLibrary  *self,
                           const char     *id,
                           int             revision,
                           GError        **error)
{
  g_autoptr(LaminaConstruction) c = lamina_library_dup_construction (self, id, revision, error);
  g_autoptr(GError) local = NULL;
  LaminaResult *result;

  if (c == NULL)
    return NULL;
  /* The layers hold the material data they were saved with, and the
   * method is deterministic: this is the figure stored at save time. */
  result = lamina_calculate (c, &local);
  if (result == NULL)
    g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_INVALID,
                 "%s: %s", c->code ? c->code : c->id, local->message);
  return result;
}

static gboolean
pinned_by_job (LaminaLibrary *self,
               const char    *id,
               int            revision)
{
  g_autoptr(GPtrArray) uses = VT (self)->list_job_uses (BE (self), id, NULL);

  /* Unreadable: treat it as pinned, which only costs a revision. */
  if (uses == NULL)
    return TRUE;
  for (guint i = 0; i < uses->len; i++)
    if (((LaminaJobUse *) uses->pdata[i])->revision == revision)
      return TRUE;
  return FALSE;
}

/* The approved revision that @head, a draft, directly follows; NULL
 * (without an error) when the head is something else, when a job pins
 * the draft (a job's revision never changes under it) or when the
 * backend keeps every draft as a revision. */
static LaminaConstruction *
draft_after_approval (LaminaLibrary             *self,
                      const LaminaConstruction  *head,
                      GError                   **error)
{
  g_autoptr(LaminaConstruction) previous = NULL;

  if (head->status != LAMINA_STATUS_DRAFT || head->revision < 2 || head->draft_stamp == NULL
      || VT (self)->replace_draft == NULL || VT (self)->drop_draft == NULL)
    return NULL;
  previous = VT (self)->get_construction (BE (self), head->id, head->revision - 1, error);
  if (previous == NULL || previous->status != LAMINA_STATUS_APPROVED
      || pinned_by_job (self, head->id, head->revision))
    return NULL;
  return g_steal_pointer (&previous);
}

/* Back to the approved revision: the draft goes, the approved revision
 * is the latest again. */
static gboolean
drop_draft (LaminaLibrary       *self,
            LaminaConstruction  *approved,
            int                  draft,
            const char          *stamp,
            GError             **error)
{
  g_autoptr(LaminaResult) result = NULL;
  g_autofree char *calc_error = NULL;
  LaminaBackendRevision rev = { approved, NULL, NULL, NULL };

  lamina_library_prepare_revision (approved, &result, &calc_error);
  rev.result = result;
  rev.calc_error = calc_error;
  if (!VT (self)->drop_draft (BE (self), &rev, draft, stamp, error))
    return FALSE;
  lamina_library_emit_changed (self);
  return TRUE;
}

static void
take_review_fields (LaminaConstruction       *to,
                    const LaminaConstruction *from)
{
  to->revision = from->revision;
  to->status = from->status;
#define TAKE(field) (g_free (to->field), to->field = g_strdup (from->field))
  TAKE (modified_by);
  TAKE (modified_at);
  TAKE (checked_by);
  TAKE (checked_at);
  TAKE (approved_by);
  TAKE (approved_at);
  TAKE (draft_stamp);
#undef TAKE
}

gboolean
lamina_library_save_construction (LaminaLibrary       *self,
                                  LaminaConstruction  *construction,
                                  int                  base_revision,
                                  const char          *author,
                                  GError             **error)
{
  g_autoptr(LaminaConstruction) head = NULL;
  g_autoptr(LaminaConstruction) approved = NULL;
  g_autoptr(LaminaConstruction) c = NULL;
  gboolean in_place;

  g_return_val_if_fail (LAMINA_IS_LIBRARY (self), FALSE);
  g_return_val_if_fail (construction != NULL && construction->id != NULL, FALSE);
  g_return_val_if_fail (base_revision > 0, FALSE);
  BACKEND_OR_FAIL (self, error, FALSE);

  head = lamina_library_dup_construction (self, construction->id, 0, error);
  if (head == NULL)
    return FALSE;
  if (head->revision == base_revision && lamina_construction_equal_content (head, construction))
    return TRUE;
  /* A draft that follows an approved revision, edited from the state the
   * caller read (its stamp): in place, or away.  A caller that does not
   * know the state (no stamp) adds a revision as always. */
  if (head->revision == base_revision && construction->revision == head->revision
      && construction->draft_stamp != NULL)
    {
      g_autoptr(GError) local = NULL;

      if (g_strcmp0 (construction->draft_stamp, head->draft_stamp) != 0)
        {
          g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_STALE,
                       "“%s” was changed by someone else (draft revision %d was saved again "
                       "after the state you edited); nothing was saved: reopen it and apply "
                       "your change again", head->name ? head->name : head->id, head->revision);
          return FALSE;
        }
      approved = draft_after_approval (self, head, &local);
      if (local != NULL)
        {
          g_propagate_error (error, g_steal_pointer (&local));
          return FALSE;
        }
    }
  /* A draft brought back to the approved build-up is no revision. */
  if (approved != NULL && lamina_construction_equal_content (approved, construction))
    {
      if (!drop_draft (self, approved, head->revision, head->draft_stamp, error))
        return FALSE;
      take_review_fields (construction, approved);
      return TRUE;
    }
  /* Work on a copy so that a refusal leaves the caller's data as it was. */
  c = lamina_construction_copy (construction);
  /* The draft's own author edits it in place while it is a draft; anyone
   * else's edit is a revision of its own, so that the history keeps who
   * wrote what. */
  in_place = approved != NULL
             && lamina_library_same_person (head->modified_by,
                                            lamina_library_default_author (author));
  lamina_library_set_new_draft (c, in_place ? base_revision : base_revision + 1, author);
  if (!store (self, c, base_revision, NULL, in_place ? head->draft_stamp : NULL, error))
    return FALSE;
  lamina_library_set_new_draft (construction, c->revision, NULL);
  g_free (construction->modified_by);
  construction->modified_by = g_strdup (c->modified_by);
  g_free (construction->modified_at);
  construction->modified_at = g_strdup (c->modified_at);
  g_free (construction->draft_stamp);
  construction->draft_stamp = g_strdup (c->draft_stamp);
  g_free (construction->code);
  construction->code = g_strdup (c->code);
  return TRUE;
}

char *
lamina_library_create_construction (LaminaLibrary       *self,
                                    LaminaConstruction  *construction,
                                    const char          *author,
                                    GError             **error)
{
  g_autoptr(LaminaConstruction) c = NULL;

  g_return_val_if_fail (LAMINA_IS_LIBRARY (self), NULL);
  g_return_val_if_fail (construction != NULL, NULL);
  BACKEND_OR_FAIL (self, error, NULL);

  c = lamina_construction_copy (construction);
  if (c->id == NULL)
    c->id = g_uuid_string_random ();
  lamina_library_set_new_draft (c, 1, author);
  if (!store (self, c, 0, NULL, NULL, error))
    return NULL;
  g_free (construction->id);
  construction->id = g_strdup (c->id);
  lamina_library_set_new_draft (construction, 1, c->modified_by);
  g_free (construction->code);
  construction->code = g_strdup (c->code);
  g_free (construction->draft_stamp);
  construction->draft_stamp = g_strdup (c->draft_stamp);
  return g_strdup (c->id);
}

char *
lamina_library_derive_construction (LaminaLibrary  *self,
                                    const char     *id,
                                    const char     *author,
                                    GError        **error)
{
  return lamina_library_derive_for_job (self, id, TRUE, TRUE, NULL, author, error);
}

/* Stores @c as a new construction named @name (no code, a new id,
 * revision 1 draft); returns the new id. */
static char *
store_copy (LaminaLibrary      *self,
            LaminaConstruction *c,
            const char         *name,
            const char         *comment,
            const char         *author,
            GError            **error)
{
  g_free (c->name);
  c->name = g_strdup (name);
  g_clear_pointer (&c->code, g_free);
  g_free (c->id);
  c->id = g_uuid_string_random ();
  lamina_library_set_new_draft (c, 1, author);
  if (!store (self, c, 0, comment, NULL, error))
    return NULL;
  return g_strdup (c->id);
}

char *
lamina_library_derive_for_job (LaminaLibrary      *self,
                               const char         *id,
                               gboolean            keep_description,
                               gboolean            keep_notes,
                               const char * const *tags,
                               const char         *author,
                               GError            **error)
{
  return lamina_library_derive_revision_for_job (self, id, 0, keep_description, keep_notes,
                                                 tags, author, error);
}

char *
lamina_library_derive_revision_for_job (LaminaLibrary      *self,
                                        const char         *id,
                                        int                 revision,
                                        gboolean            keep_description,
                                        gboolean            keep_notes,
                                        const char * const *tags,
                                        const char         *author,
                                        GError            **error)
{
  g_autoptr(LaminaConstruction) c = NULL;
  g_autofree char *comment = NULL;
  g_autofree char *name = NULL;

  g_return_val_if_fail (LAMINA_IS_LIBRARY (self), NULL);
  g_return_val_if_fail (id != NULL, NULL);
  BACKEND_OR_FAIL (self, error, NULL);
  /* A new job starts from what was approved, not from a draft that
   * follows it, unless another revision is asked for. */
  revision = lamina_library_pick_revision (self, id, revision, NULL, error);
  if (revision <= 0 || (c = lamina_library_dup_construction (self, id, revision, error)) == NULL)
    return NULL;
  comment = g_strdup_printf ("derived from %s revision %d", c->code ? c->code : id, c->revision);
  name = g_strdup_printf (_("%s (copy)"), c->name);
  /* The old job's words do not belong to the new one unless asked for. */
  if (!keep_description)
    g_clear_pointer (&c->description, g_free);
  if (!keep_notes)
    g_clear_pointer (&c->notes, g_free);
  if (tags != NULL)
    for (guint i = c->tags->len; i-- > 0;)
      if (!g_strv_contains (tags, c->tags->pdata[i]))
        g_ptr_array_remove_index (c->tags, i);
  return store_copy (self, c, name, comment, author, error);
}

char *
lamina_library_derive_job_variant (LaminaLibrary  *self,
                                   const char     *id,
                                   int             revision,
                                   const char     *job_name,
                                   const char     *author,
                                   GError        **error)
{
  g_autoptr(LaminaConstruction) c = lamina_library_dup_construction (self, id, revision, error);
  g_autofree char *comment = NULL;
  g_autofree char *name = NULL;

  if (c == NULL)
    return NULL;
  comment = g_strdup_printf ("job variant of %s revision %d", c->code ? c->code : id, c->revision);
  name = g_strdup_printf (_("%s (variant for %s)"), c->name, job_name);
  return store_copy (self, c, name, comment, author, error);
}

gboolean
lamina_library_delete_construction (LaminaLibrary  *self,
                                    const char     *id,
                                    const char     *author,
                                    GError        **error)
{
  g_autofree char *now = lamina_library_dup_now ();

  g_return_val_if_fail (LAMINA_IS_LIBRARY (self), FALSE);
  g_return_val_if_fail (id != NULL, FALSE);
  BACKEND_OR_FAIL (self, error, FALSE);
  if (!VT (self)->set_deleted (BE (self), id, now, error))
    return FALSE;
  lamina_library_emit_changed (self);
  return TRUE;
}

gboolean
lamina_library_restore_construction (LaminaLibrary  *self,
                                     const char     *id,
                                     GError        **error)
{
  g_return_val_if_fail (LAMINA_IS_LIBRARY (self), FALSE);
  g_return_val_if_fail (id != NULL, FALSE);
  BACKEND_OR_FAIL (self, error, FALSE);
  if (!VT (self)->set_deleted (BE (self), id, NULL, error))
    return FALSE;
  lamina_library_emit_changed (self);
  return TRUE;
}

GPtrArray *
lamina_library_dup_history (LaminaLibrary  *self,
                            const char     *id,
                            GError        **error)
{
  g_return_val_if_fail (LAMINA_IS_LIBRARY (self), NULL);
  g_return_val_if_fail (id != NULL, NULL);
  BACKEND_OR_FAIL (self, error, NULL);
  return VT (self)->get_history (BE (self), id, error);
}

GPtrArray *
lamina_library_search (LaminaLibrary             *self,
                       const LaminaLibraryQuery  *query,
                       GError                   **error)
{
  g_return_val_if_fail (LAMINA_IS_LIBRARY (self), NULL);
  g_return_val_if_fail (query != NULL, NULL);
  BACKEND_OR_FAIL (self, error, NULL);
  return VT (self)->search (BE (self), query, error);
}

gint64
lamina_library_count (LaminaLibrary             *self,
                      const LaminaLibraryQuery  *query,
                      GError                   **error)
{
  g_return_val_if_fail (LAMINA_IS_LIBRARY (self), -1);
  g_return_val_if_fail (query != NULL, -1);
  BACKEND_OR_FAIL (self, error, -1);
  return VT (self)->count (BE (self), query, error);
}

gint64
lamina_library_count_at_most (LaminaLibrary             *self,
                              const LaminaLibraryQuery  *query,
                              gint64                     at_most,
                              GError                   **error)
{
  gint64 n;

  g_return_val_if_fail (LAMINA_IS_LIBRARY (self), -1);
  g_return_val_if_fail (query != NULL, -1);
  g_return_val_if_fail (at_most >= 0, -1);
  BACKEND_OR_FAIL (self, error, -1);
  if (VT (self)->count_at_most != NULL)
    n = VT (self)->count_at_most (BE (self), query, at_most, error);
  else
    n = VT (self)->count (BE (self), query, error);
  return n > at_most ? at_most + 1 : n;
}

GPtrArray *
lamina_library_list_tags (LaminaLibrary  *self,
                          GError        **error)
{
  g_return_val_if_fail (LAMINA_IS_LIBRARY (self), NULL);
  BACKEND_OR_FAIL (self, error, NULL);
  return VT (self)->list_tags (BE (self), error);
}
