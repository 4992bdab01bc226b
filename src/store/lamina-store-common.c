/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-store-common.c: what the SQLite and PostgreSQL backends derive
 * the same way from what they store (see lamina-store-common.h). */
#define G_LOG_DOMAIN "lamina-store"

#include "lamina-store-common.h"

#include "lamina-library-backend.h"
#include "lamina-library-seed.h"
#include "lamina-store-json.h"

#include <math.h>
#include <string.h>

char *
lamina_store_record_body_dup (const LaminaTargetSet  *set,
                              const LaminaJob        *job,
                              GError                **error)
{
  g_autoptr(LaminaCatalogue) catalogue = lamina_catalogue_new ();
  char *body;

  if (set != NULL)
    g_ptr_array_add (catalogue->target_sets, (gpointer) set);
  if (job != NULL)
    g_ptr_array_add (catalogue->jobs, (gpointer) job);
  body = lamina_catalogue_write_to_string (catalogue, LAMINA_WRITE_DEFAULT, NULL, error);
  /* Borrowed: take them out before the catalogue frees its arrays. */
  if (set != NULL)
    g_ptr_array_steal_index (catalogue->target_sets, 0);
  if (job != NULL)
    g_ptr_array_steal_index (catalogue->jobs, 0);
  return body;
}

LaminaCatalogue *
lamina_store_record_body_read (const char  *text,
                               gssize       len,
                               const char  *id,
                               GError     **error)
{
  g_autofree char *name = g_strdup_printf ("stored record “%s”", id);

  if (len < 0)
    len = (gssize) strlen (text);
  return lamina_catalogue_read_memory (text, (gsize) len, name, error);
}

gboolean
lamina_store_check_base (const LaminaConstruction  *c,
                         int                        base,
                         int                        head,
                         gboolean                   deleted,
                         GError                   **error)
{
  if (base == 0 && head > 0)
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_EXISTS,
                   "a construction with id “%s” exists already", c->id);
      return FALSE;
    }
  if (base > 0 && (head == 0 || deleted))
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_NOT_FOUND,
                   "no construction “%s” in the library", c->id);
      return FALSE;
    }
  if (base > 0 && head != base)
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_STALE,
                   "“%s” was changed by someone else (revision %d was saved after "
                   "revision %d you edited); nothing was saved: reopen it and "
                   "apply your change again", c->name ? c->name : c->id, head, base);
      return FALSE;
    }
  return TRUE;
}

void
lamina_store_set_code_used_error (GError     **error,
                                  const char  *code,
                                  const char  *user)
{
  g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_EXISTS,
               "construction code “%s”: already used by “%s” in this library; "
               "office codes are unique", code, user);
}

gboolean
lamina_store_check_draft_head (const char    *id,
                               int            draft,
                               int            head,
                               gboolean       deleted,
                               LaminaStatus   status,
                               gboolean       same_stamp,
                               GError       **error)
{
  if (head == 0 || deleted)
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_NOT_FOUND,
                   "no construction “%s” in the library", id);
      return FALSE;
    }
  if (head != draft || status != LAMINA_STATUS_DRAFT || !same_stamp)
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_STALE,
                   "construction “%s” was changed by someone else (its latest revision is %d, "
                   "%s, saved since you opened it); nothing was saved: reopen it and apply "
                   "your change again", id, head, lamina_status_to_string (status));
      return FALSE;
    }
  return TRUE;
}

void
lamina_store_construction_row_for_revision (LaminaStoreConstructionRow *row,
                                            const LaminaConstruction   *c,
                                            const LaminaResult         *r,
                                            double                      moisture_limit)
{
  *row = (LaminaStoreConstructionRow) {
    .id = c->id,
    .head = c->revision,
    .code = c->code,
    .name = c->name ? c->name : "",
    .element = lamina_element_to_string (c->element),
    .status = lamina_status_to_string (c->status),
    .u = r ? r->u : NAN,
    .u_corrected = r ? r->u_corrected : NAN,
    .target_u = c->target_u,
    .thickness = lamina_construction_get_thickness (c),
    .flags = (int) (lamina_store_summary_flags (r)
                    | lamina_library_moisture_flags_for_limit (c, moisture_limit)),
    .modified_at = c->modified_at,
  };
}

void
lamina_store_construction_row_for_record (LaminaStoreConstructionRow *row,
                                          const LaminaBackendRecord  *record)
{
  const LaminaBackendRecordRevision *head = record->revisions->pdata[record->revisions->len - 1];
  const LaminaConstruction *c = head->construction;

  *row = (LaminaStoreConstructionRow) {
    .id = record->id,
    .head = head->revision,
    .code = c->code,
    .name = c->name ? c->name : "",
    .element = lamina_element_to_string (c->element),
    .status = lamina_status_to_string (head->status),
    .u = head->u,
    .u_corrected = head->u_corrected,
    .target_u = c->target_u,
    .thickness = head->thickness,
    .flags = record->flags,
    .modified_at = head->modified_at,
    .deleted_at = record->deleted_at,
    .material_changed = record->material_changed,
  };
}

void
lamina_store_revision_row_for (LaminaBackendRecordRevision *row,
                               const LaminaBackendRevision *rev,
                               const char                  *body)
{
  const LaminaConstruction *c = rev->construction;
  const LaminaResult *r = rev->result;

  /* The row only lends its strings to the binding: none is freed. */
  *row = (LaminaBackendRecordRevision) {
    .revision = c->revision,
    .status = c->status,
    .body = (char *) body,
    .u = r ? r->u : NAN,
    .u_corrected = r ? r->u_corrected : NAN,
    .r_total = r ? r->r_total : NAN,
    .thickness = lamina_construction_get_thickness (c),
    .calc_error = (char *) rev->calc_error,
    .modified_by = c->modified_by,
    .modified_at = c->modified_at,
    .checked_by = c->checked_by,
    .checked_at = c->checked_at,
    .approved_by = c->approved_by,
    .approved_at = c->approved_at,
    .comment = (char *) rev->comment,
  };
}

LaminaSummaryFlags
lamina_store_summary_flags (const LaminaResult *r)
{
  LaminaSummaryFlags flags = LAMINA_SUMMARY_NONE;

  if (r == NULL)
    return LAMINA_SUMMARY_NOT_CALCULATED;
  if (r->has_target && !r->target_met)
    flags |= LAMINA_SUMMARY_TARGET_NOT_MET;
  if (r->warnings != NULL && r->warnings->len > 0)
    flags |= LAMINA_SUMMARY_HAS_WARNINGS;
  return flags;
}

static void
collect_material (GHashTable           *materials,
                  GString              *names,
                  const LaminaMaterial *m)
{
  if (m == NULL)
    return;
  if (m->name != NULL && names != NULL)
    g_string_append_printf (names, "%s ", m->name);
  if (m->id != NULL && !g_hash_table_contains (materials, m->id))
    g_hash_table_insert (materials, m->id, lamina_store_material_fingerprint (m));
}

GHashTable *
lamina_store_collect_materials (const LaminaConstruction *c,
                                GString                  *names)
{
  GHashTable *materials = g_hash_table_new_full (g_str_hash, g_str_equal, NULL, g_free);

  for (guint i = 0; i < c->layers->len; i++)
    {
      const LaminaLayer *layer = c->layers->pdata[i];

      collect_material (materials, names, layer->material);
      for (guint k = 0; layer->parts != NULL && k < layer->parts->len; k++)
        collect_material (materials, names, ((LaminaPart *) layer->parts->pdata[k])->material);
    }
  return materials;
}

static void
add_word (GPtrArray  *words,
          GString    *word)
{
  g_autofree char *nfd = g_utf8_normalize (word->str, -1, G_NORMALIZE_NFD);
  g_autoptr(GString) bare = g_string_new (NULL);
  g_autofree char *lower = NULL;

  /* unicode61 with remove_diacritics: the marks go, the letters stay. */
  for (const char *p = nfd; p != NULL && *p; p = g_utf8_next_char (p))
    if (!g_unichar_ismark (g_utf8_get_char (p)))
      g_string_append_unichar (bare, g_utf8_get_char (p));
  g_string_truncate (word, 0);
  if (bare->len == 0)
    return;
  lower = g_utf8_strdown (bare->str, -1);
  for (guint i = 0; i < words->len; i++)
    if (strcmp (words->pdata[i], lower) == 0)
      return;
  g_ptr_array_add (words, g_steal_pointer (&lower));
}

void
lamina_store_add_search_words (GPtrArray  *words,
                               const char *text)
{
  g_autoptr(GString) word = g_string_new (NULL);

  if (text == NULL || !g_utf8_validate (text, -1, NULL))
    return;
  for (const char *p = text; ; p = g_utf8_next_char (p))
    {
      gunichar ch = g_utf8_get_char (p);

      if (ch != 0 && (g_unichar_isalnum (ch) || g_unichar_ismark (ch)))
        {
          g_string_append_unichar (word, ch);
          continue;
        }
      if (word->len > 0)
        add_word (words, word);
      if (ch == 0)
        break;
    }
}

LaminaMaterial *
lamina_store_seed_material_new (guint i)
{
  guint n = 0;
  const LaminaSeedMaterial *seed = lamina_library_get_seed_materials (&n);
  LaminaMaterial *m;

  g_return_val_if_fail (i < n, NULL);
  m = lamina_material_new (seed[i].id, seed[i].name, seed[i].category, seed[i].conductivity);
  m->density = seed[i].density;
  m->specific_heat = seed[i].specific_heat;
  m->vapour_resistance_factor = seed[i].mu;
  m->source = g_strdup (seed[i].source);
  if (seed[i].category == LAMINA_CATEGORY_INSULATION)
    m->notes = g_strdup ("Value recalled, verify. Insulation has no generic design value: use the λ "
                         "declared for the product (EN 13162 to EN 13171 declarations), "
                         "converted to design conditions by EN ISO 10456 where needed.");
  else
    m->notes = g_strdup ("Value recalled, verify against the table before relying on it.");
  return m;
}
