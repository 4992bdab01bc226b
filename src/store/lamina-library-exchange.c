/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-library-exchange.c: import and export of the catalogue, and the
 * "material data changed since review" check. */
#define G_LOG_DOMAIN "lamina-store"

#include "lamina-library.h"

#include "lamina-library-backend.h"
#include "lamina-store-json.h"

#include <glib/gi18n-lib.h>

/* How a report names a construction: the office code and the name a
 * practitioner knows it by, never the internal id. */
static char *
dup_label (const LaminaConstruction *c)
{
  if (c->code && c->name)
    return g_strdup_printf ("%s “%s”", c->code, c->name);
  return g_strdup_printf ("“%s”", c->name ? c->name : c->id);
}

char *
lamina_import_report_dup_summary (const LaminaImportReport *report)
{
  g_autofree char *constructions = NULL;
  g_autofree char *conflicts = NULL;
  g_autofree char *materials = NULL;

  g_return_val_if_fail (report != NULL, NULL);

  /* The same words as the window's report: added, revised, unchanged. */
  constructions = g_strdup_printf (_("%u added, %u revised, %u unchanged"),
                                   report->n_added, report->n_revised, report->n_skipped);
  conflicts = g_strdup_printf (g_dngettext (GETTEXT_PACKAGE, "%u conflict", "%u conflicts", report->n_conflicts),
                               report->n_conflicts);
  materials = g_strdup_printf (g_dngettext (GETTEXT_PACKAGE, "%u material added, %u updated",
                                            "%u materials added, %u updated", report->n_materials_added),
                               report->n_materials_added, report->n_materials_updated);
  /* TRANSLATORS: "20 added, 0 revised, 0 unchanged, 1 conflict; 33 materials added, 0 updated" */
  return g_strdup_printf (_("%s, %s; %s"), constructions, conflicts, materials);
}

static void
add_item (LaminaImportReport *report,
          LaminaImportAction  action,
          gboolean            is_material,
          const char         *id,
          const char         *name,
          int                 revision,
          char               *message)
{
  lamina_import_report_add_item (report, action, is_material, id, name, revision, message);
}

/* A climate of the document (EN ISO 13788): added when new, replaced when
 * different only with LAMINA_IMPORT_UPDATE_MATERIALS (the constructions
 * checked with it are then flagged), as for materials.  Imported
 * constructions keep the climate data of their document. */
static gboolean
merge_climate (LaminaLibrary        *self,
               const LaminaClimate  *climate,
               LaminaImportFlags     flags,
               LaminaImportReport   *report,
               GPtrArray            *to_put,
               GError              **error)
{
  g_autoptr(GError) local = NULL;
  g_autoptr(LaminaClimate) existing = VT (self)->get_climate (BE (self), climate->id, &local);
  g_autoptr(LaminaClimate) copy = lamina_climate_copy (climate);

  if (existing == NULL && !g_error_matches (local, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_NOT_FOUND))
    {
      g_propagate_error (error, g_steal_pointer (&local));
      return FALSE;
    }
  copy->line = 0;
  if (existing == NULL)
    {
      add_item (report, LAMINA_IMPORT_ADDED, FALSE, climate->id, climate->name, 0,
                g_strdup_printf (_("climate “%s” added"), climate->name));
      g_ptr_array_add (to_put, g_steal_pointer (&copy));
    }
  else if (!lamina_climate_equal (existing, copy))
    {
      if (flags & LAMINA_IMPORT_UPDATE_MATERIALS)
        {
          add_item (report, LAMINA_IMPORT_REVISED, FALSE, climate->id, climate->name, 0,
                    g_strdup_printf (_("climate “%s” updated; constructions checked with it "
                                       "are flagged for review"), climate->name));
          g_ptr_array_add (to_put, g_steal_pointer (&copy));
        }
      else
        {
          report->n_conflicts++;
          add_item (report, LAMINA_IMPORT_CONFLICT, FALSE, climate->id, climate->name, 0,
                    g_strdup_printf (_("climate “%s” differs from the library's; the library's "
                                       "is kept (imported constructions keep their own data)"),
                                     climate->name));
        }
    }
  return TRUE;
}

static gboolean
merge_material (LaminaLibrary         *self,
                const LaminaMaterial  *m,
                LaminaImportFlags      flags,
                LaminaImportReport    *report,
                GPtrArray             *to_put,
                GError               **error)
{
  g_autoptr(GError) local = NULL;
  g_autoptr(LaminaMaterial) existing = NULL;

  if (m->id == NULL)
    return TRUE;
  existing = VT (self)->get_material (BE (self), m->id, &local);
  if (existing == NULL && !g_error_matches (local, LAMINA_LIBRARY_ERROR,
                                            LAMINA_LIBRARY_ERROR_NOT_FOUND))
    {
      g_propagate_error (error, g_steal_pointer (&local));
      return FALSE;
    }
  if (existing == NULL)
    {
      report->n_materials_added++;
      add_item (report, LAMINA_IMPORT_ADDED, TRUE, m->id, m->name, 0,
                g_strdup_printf (_("material “%s” added"), m->name));
      g_ptr_array_add (to_put, lamina_material_copy (m));
    }
  else if (!lamina_material_equal (existing, m))
    {
      if (flags & LAMINA_IMPORT_UPDATE_MATERIALS)
        {
          report->n_materials_updated++;
          add_item (report, LAMINA_IMPORT_REVISED, TRUE, m->id, m->name, 0,
                    g_strdup_printf (_("material “%s” updated; constructions using it "
                                       "are flagged for review"), m->name));
          g_ptr_array_add (to_put, lamina_material_copy (m));
        }
      else
        {
          report->n_conflicts++;
          add_item (report, LAMINA_IMPORT_CONFLICT, TRUE, m->id, m->name, 0,
                    g_strdup_printf (_("material “%s” differs from the library's; the "
                                       "library's is kept (imported layers keep their "
                                       "own data)"), m->name));
        }
    }
  return TRUE;
}

/* The document's review record of @c in words (stored, so not
 * translated, like the history's other comments), NULL when it has none:
 * "approved in the source library by B. Boss on 2026-03-01, checked by
 * C. Checker on 2026-02-27". */
static char *
dup_source_review (const LaminaConstruction *c)
{
  g_autoptr(GString) text = g_string_new (NULL);

  if (c->status == LAMINA_STATUS_APPROVED && c->approved_by != NULL)
    {
      g_string_append_printf (text, "approved in the source library by %s", c->approved_by);
      if (c->approved_at != NULL)
        g_string_append_printf (text, " on %.10s", c->approved_at);
    }
  if (c->status != LAMINA_STATUS_DRAFT && c->checked_by != NULL)
    {
      g_string_append (text, text->len > 0 ? ", checked by " : "checked in the source library by ");
      g_string_append (text, c->checked_by);
      if (c->checked_at != NULL)
        g_string_append_printf (text, " on %.10s", c->checked_at);
    }
  return text->len > 0 ? g_string_free (g_steal_pointer (&text), FALSE) : NULL;
}

/* Imported review records are not this library's approvals: without
 * LAMINA_IMPORT_KEEP_REVIEW a construction arrives as a draft and the
 * document's record is kept in words; with it the state is kept and the
 * words say it was approved elsewhere. */
static void
take_source_review (LaminaConstruction *c,
                    LaminaImportFlags   flags)
{
  g_free (c->source_review);
  c->source_review = dup_source_review (c);
  if (flags & LAMINA_IMPORT_KEEP_REVIEW)
    return;
  c->status = LAMINA_STATUS_DRAFT;
  g_clear_pointer (&c->checked_by, g_free);
  g_clear_pointer (&c->checked_at, g_free);
  g_clear_pointer (&c->approved_by, g_free);
  g_clear_pointer (&c->approved_at, g_free);
}

/* Decides what happens to one imported construction; adds a revision to
 * @revisions (owning @c through @keep) when something is to be stored. */
static gboolean
merge_construction (LaminaLibrary             *self,
                    const LaminaConstruction  *imported,
                    LaminaImportFlags          flags,
                    const char                *author,
                    LaminaImportReport        *report,
                    GPtrArray                 *keep,
                    GArray                    *bases,
                    GError                   **error)
{
  g_autoptr(GError) local = NULL;
  g_autoptr(LaminaConstruction) head = NULL;
  LaminaConstruction *c;
  g_autofree char *label = NULL;
  int base = 0;

  head = VT (self)->get_construction (BE (self), imported->id, 0, &local);
  if (head == NULL && !g_error_matches (local, LAMINA_LIBRARY_ERROR,
                                        LAMINA_LIBRARY_ERROR_NOT_FOUND))
    {
      g_propagate_error (error, g_steal_pointer (&local));
      return FALSE;
    }
  if (head != NULL && lamina_construction_equal_content (head, imported))
    {
      g_autofree char *head_label = dup_label (head);

      report->n_skipped++;
      add_item (report, LAMINA_IMPORT_SKIPPED, FALSE, head->id, head->name, head->revision,
                g_strdup_printf (_("%s: unchanged, the same as revision %d"), head_label, head->revision));
      return TRUE;
    }
  if (head != NULL && head->status == LAMINA_STATUS_APPROVED
      && !(flags & LAMINA_IMPORT_REVISE_APPROVED))
    {
      g_autofree char *head_label = dup_label (head);

      report->n_conflicts++;
      add_item (report, LAMINA_IMPORT_CONFLICT, FALSE, head->id, head->name, head->revision,
                g_strdup_printf (_("%s: differs from approved revision %d; not applied"),
                                 head_label, head->revision));
      return TRUE;
    }

  /* Office codes are unique within a library: another construction's
   * code is a conflict, never a silent second "EW-101". */
  {
    g_autoptr(GError) code_error = NULL;
    g_autofree char *other = lamina_library_dup_code_user (self, imported->code, imported->id,
                                                           &code_error);
    g_autoptr(LaminaConstruction) user = NULL;
    g_autofree char *imported_label = NULL;

    /* Read before the import's transaction: a busy library only skips
     * the check. */
    if (code_error != NULL)
      g_debug ("office code check skipped: %s", code_error->message);
    if (other != NULL)
      {
        user = VT (self)->get_construction (BE (self), other, 0, NULL);
        imported_label = dup_label (imported);
        report->n_conflicts++;
        add_item (report, LAMINA_IMPORT_CONFLICT, FALSE, imported->id, imported->name, 0,
                  g_strdup_printf (_("%s: the code %s is already used by “%s” in this library; "
                                     "not imported (office codes are unique)"), imported_label,
                                   imported->code, user && user->name ? user->name : other));
        return TRUE;
      }
  }
  c = lamina_construction_copy (imported);
  g_ptr_array_add (keep, c);
  label = dup_label (c);
  if (head == NULL)
    {
      /* A new construction keeps its revision number; its review record
       * only with LAMINA_IMPORT_KEEP_REVIEW. */
      c->revision = MAX (c->revision, 1);
      take_source_review (c, flags);
      if (c->modified_by == NULL)
        c->modified_by = g_strdup (lamina_library_default_author (author));
      if (c->modified_at == NULL)
        c->modified_at = lamina_library_dup_now ();
      report->n_added++;
      add_item (report, LAMINA_IMPORT_ADDED, FALSE, c->id, c->name, c->revision,
                g_strdup_printf (_("%s: added as revision %d (%s)"), label, c->revision,
                                 lamina_status_to_string (c->status)));
    }
  else
    {
      g_autofree char *source = dup_source_review (c);

      base = head->revision;
      /* A change to one of ours is our draft, whatever the document says. */
      lamina_library_set_new_draft (c, base + 1, author);
      c->source_review = g_steal_pointer (&source);
      report->n_revised++;
      add_item (report, LAMINA_IMPORT_REVISED, FALSE, c->id, c->name, c->revision,
                g_strdup_printf (_("%s: revised, stored as draft revision %d"), label, c->revision));
    }
  g_array_append_val (bases, base);
  return TRUE;
}

/* The history's line for an imported revision (owned by @comments). */
static const char *
comment_for (GPtrArray                *comments,
             const LaminaConstruction *c)
{
  char *comment;

  if (c->source_review == NULL)
    return "imported";
  if (c->status == LAMINA_STATUS_DRAFT)
    comment = g_strdup_printf ("imported as a draft; %s", c->source_review);
  else
    comment = g_strdup_printf ("imported with its review, approved elsewhere: %s", c->source_review);
  g_ptr_array_add (comments, comment);
  return comment;
}

static void
revision_free (LaminaBackendRevision *rev)
{
  lamina_result_free ((LaminaResult *) rev->result);
  g_free ((char *) rev->calc_error);
  g_free (rev);
}

static LaminaImportReport *
import_once (LaminaLibrary          *self,
             const LaminaCatalogue  *catalogue,
             LaminaImportFlags       flags,
             const char             *author,
             GError                **error)
{
  g_autoptr(LaminaImportReport) report = lamina_import_report_new ();
  g_autoptr(GPtrArray) materials = g_ptr_array_new_with_free_func ((GDestroyNotify) lamina_material_free);
  g_autoptr(GPtrArray) climates = g_ptr_array_new_with_free_func ((GDestroyNotify) lamina_climate_free);
  g_autoptr(GPtrArray) keep = g_ptr_array_new_with_free_func ((GDestroyNotify) lamina_construction_free);
  g_autoptr(GPtrArray) revisions = g_ptr_array_new_with_free_func ((GDestroyNotify) revision_free);
  g_autoptr(GPtrArray) comments = g_ptr_array_new_with_free_func (g_free);
  g_autoptr(GArray) bases = g_array_new (FALSE, FALSE, sizeof (int));
  g_autoptr(GHashTable) seen = g_hash_table_new_full (g_str_hash, g_str_equal, g_free, NULL);
  g_autoptr(GHashTable) codes = g_hash_table_new_full (g_str_hash, g_str_equal, g_free, g_free);
  g_autoptr(GPtrArray) target_sets = g_ptr_array_new_with_free_func ((GDestroyNotify) lamina_target_set_free);
  g_autoptr(GPtrArray) jobs = g_ptr_array_new_with_free_func ((GDestroyNotify) lamina_job_free);
  g_autofree char *now = lamina_library_dup_now ();
  LaminaBackendImport import = { 0 };

  g_return_val_if_fail (LAMINA_IS_LIBRARY (self), NULL);
  g_return_val_if_fail (catalogue != NULL, NULL);
  if (BE (self) == NULL)
    {
      g_set_error_literal (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_IO,
                           "the library is closed");
      return NULL;
    }

  for (guint i = 0; catalogue->materials && i < catalogue->materials->len; i++)
    {
      g_autoptr(LaminaMaterial) m = lamina_material_copy (catalogue->materials->pdata[i]);
      g_autofree char *where = g_strdup_printf ("material %u", i + 1);

      /* Look-alike ids, as for the constructions below. */
      if (!lamina_library_clean_material_identity (m, where, error))
        {
          g_prefix_error (error, "nothing was imported: ");
          return NULL;
        }
      if (!merge_material (self, m, flags, report, materials, error))
        return NULL;
    }
  for (guint i = 0; catalogue->climates && i < catalogue->climates->len; i++)
    if (!merge_climate (self, catalogue->climates->pdata[i], flags, report, climates, error))
      return NULL;
  for (guint i = 0; i < catalogue->constructions->len; i++)
    {
      const LaminaConstruction *given = catalogue->constructions->pdata[i];
      g_autoptr(LaminaConstruction) c = NULL;
      g_autofree char *where = NULL;
      g_autofree char *code_key = NULL;

      if (given->id == NULL || given->name == NULL)
        {
          g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_INVALID,
                       "construction %u (line %d): %s required; nothing was imported",
                       i + 1, given->line, given->id == NULL ? "id" : "name");
          return NULL;
        }
      /* Look-alike ids and codes: NFC, and no control or format
       * characters, or nothing is imported. */
      c = lamina_construction_copy (given);
      where = g_strdup_printf ("construction %u (line %d)", i + 1, given->line);
      if (!lamina_library_clean_construction_identity (c, TRUE, where, error))
        {
          g_prefix_error (error, "nothing was imported: ");
          return NULL;
        }
      lamina_library_normalize_layer_material_ids (c);
      if (!g_hash_table_add (seen, g_strdup (c->id)))
        {
          g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_INVALID,
                       "construction “%s” (line %d) appears twice; nothing was imported",
                       c->id, c->line);
          return NULL;
        }
      code_key = c->code ? g_ascii_strdown (c->code, -1) : NULL;
      if (code_key != NULL && g_hash_table_contains (codes, code_key))
        {
          g_autofree char *label = dup_label (c);

          report->n_conflicts++;
          add_item (report, LAMINA_IMPORT_CONFLICT, FALSE, c->id, c->name, 0,
                    g_strdup_printf (_("%s: the code %s is also used by “%s” earlier in the "
                                       "document; not imported (office codes are unique)"),
                                     label, c->code, (char *) g_hash_table_lookup (codes, code_key)));
          continue;
        }
      if (code_key != NULL)
        g_hash_table_insert (codes, g_steal_pointer (&code_key), g_strdup (c->name));
      if (!merge_construction (self, c, flags, author, report, keep, bases, error))
        return NULL;
    }
  for (guint i = 0; i < keep->len; i++)
    {
      LaminaBackendRevision *rev = g_new0 (LaminaBackendRevision, 1);
      LaminaResult *result = NULL;
      char *calc_error = NULL;

      rev->construction = keep->pdata[i];
      lamina_library_prepare_revision (keep->pdata[i], &result, &calc_error);
      rev->result = result;
      rev->calc_error = calc_error;
      rev->comment = comment_for (comments, keep->pdata[i]);
      g_ptr_array_add (revisions, rev);
    }
  if (!lamina_library_merge_records (self, catalogue, report, target_sets, jobs, error))
    return NULL;
  if (flags & LAMINA_IMPORT_DRY_RUN)
    return g_steal_pointer (&report);
  import.materials = materials;
  import.revisions = revisions;
  import.base_revisions = bases;
  import.target_sets = target_sets;
  import.jobs = jobs;
  import.climates = climates;
  if (!VT (self)->apply_import_records (BE (self), &import, now, error))
    return NULL;
  if (materials->len > 0 || revisions->len > 0 || target_sets->len > 0 || jobs->len > 0
      || climates->len > 0)
    lamina_library_emit_changed (self);
  return g_steal_pointer (&report);
}

/* The import is planned against the library as it is, then written in
 * one transaction.  Another program may have written the same document
 * in between (two imports started together: ours planned "add" while
 * theirs held the lock): the write is then refused as taken or stale and
 * nothing was written, so plan again against what is there now; the
 * second import ends as "unchanged", never as a conflict. */
LaminaImportReport *
lamina_library_import (LaminaLibrary          *self,
                       const LaminaCatalogue  *catalogue,
                       LaminaImportFlags       flags,
                       const char             *author,
                       GError                **error)
{
  for (int attempt = 1;; attempt++)
    {
      g_autoptr(GError) local = NULL;
      LaminaImportReport *report = import_once (self, catalogue, flags, author, &local);

      if (report != NULL)
        return report;
      if (attempt >= 5
          || !(g_error_matches (local, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_EXISTS)
               || g_error_matches (local, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_STALE)))
        {
          g_propagate_error (error, g_steal_pointer (&local));
          return NULL;
        }
      g_debug ("import: the library changed while planning (%s); planning again",
               local->message);
    }
}

static void
collect_ids (GHashTable               *ids,
             const LaminaConstruction *c)
{
  for (guint i = 0; i < c->layers->len; i++)
    {
      const LaminaLayer *layer = c->layers->pdata[i];

      if (layer->material && layer->material->id)
        g_hash_table_add (ids, layer->material->id);
      for (guint k = 0; layer->parts && k < layer->parts->len; k++)
        {
          const LaminaPart *p = layer->parts->pdata[k];

          if (p->material && p->material->id)
            g_hash_table_add (ids, p->material->id);
        }
    }
}

/* Every library climate for a whole export, else the ones the exported
 * constructions are checked with; a climate missing from the library is
 * written from the construction's own copy. */
static gboolean
export_climates (LaminaLibrary   *self,
                 LaminaCatalogue *cat,
                 gboolean         all,
                 GError         **error)
{
  g_autoptr(GPtrArray) library = VT (self)->list_climates (BE (self), error);

  if (library == NULL)
    return FALSE;
  for (guint i = 0; i < library->len; i++)
    {
      LaminaClimate *climate = library->pdata[i];
      gboolean used = all;

      for (guint k = 0; !used && k < cat->constructions->len; k++)
        {
          const LaminaConstruction *c = cat->constructions->pdata[k];

          used = c->moisture != NULL && g_strcmp0 (c->moisture->climate, climate->id) == 0;
        }
      if (used)
        g_ptr_array_add (cat->climates, lamina_climate_copy (climate));
    }
  for (guint k = 0; k < cat->constructions->len; k++)
    {
      const LaminaConstruction *c = cat->constructions->pdata[k];

      if (c->moisture != NULL && c->moisture->climate_data != NULL
          && lamina_catalogue_find_climate (cat, c->moisture->climate) == NULL)
        g_ptr_array_add (cat->climates, lamina_climate_copy (c->moisture->climate_data));
    }
  return TRUE;
}

LaminaCatalogue *
lamina_library_export (LaminaLibrary       *self,
                       const char * const  *ids,
                       GError             **error)
{
  g_autoptr(LaminaCatalogue) cat = lamina_catalogue_new ();
  g_autoptr(GPtrArray) all = NULL;
  g_autoptr(GHashTable) used = g_hash_table_new (g_str_hash, g_str_equal);

  g_return_val_if_fail (LAMINA_IS_LIBRARY (self), NULL);
  if (BE (self) == NULL)
    {
      g_set_error_literal (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_IO,
                           "the library is closed");
      return NULL;
    }
  if (ids == NULL)
    {
      all = VT (self)->list_ids (BE (self), error);
      if (all == NULL)
        return NULL;
      g_ptr_array_add (all, NULL);
      ids = (const char * const *) all->pdata;
    }
  for (guint i = 0; ids[i] != NULL; i++)
    {
      LaminaConstruction *c = VT (self)->get_construction (BE (self), ids[i], 0, error);

      if (c == NULL)
        return NULL;
      g_ptr_array_add (cat->constructions, c);
      collect_ids (used, c);
    }
  if (!export_climates (self, cat, all != NULL, error))
    return NULL;
  if (all != NULL)
    {
      g_autoptr(GPtrArray) materials = VT (self)->list_materials (BE (self), error);

      if (materials == NULL)
        return NULL;
      for (guint i = 0; i < materials->len; i++)
        g_ptr_array_add (cat->materials, lamina_material_copy (materials->pdata[i]));
      if (!lamina_library_export_records (self, cat, error))
        return NULL;
    }
  else
    {
      g_autoptr(GList) keys = g_list_sort (g_hash_table_get_keys (used), (GCompareFunc) g_strcmp0);

      for (GList *l = keys; l != NULL; l = l->next)
        {
          LaminaMaterial *m = VT (self)->get_material (BE (self), l->data, NULL);

          if (m != NULL)
            g_ptr_array_add (cat->materials, m);
        }
    }
  return g_steal_pointer (&cat);
}

/* Material data changed since review */

static void
compare_material (LaminaLibrary        *self,
                  const LaminaMaterial *stored,
                  GHashTable           *seen,
                  GPtrArray            *changes)
{
  g_autoptr(LaminaMaterial) library = NULL;
  g_autofree char *a = NULL, *b = NULL;
  LaminaMaterialChange *change;

  if (stored == NULL || stored->id == NULL || !g_hash_table_add (seen, stored->id))
    return;
  library = VT (self)->get_material (BE (self), stored->id, NULL);
  if (library == NULL)
    return;
  a = lamina_store_material_fingerprint (stored);
  b = lamina_store_material_fingerprint (library);
  if (g_strcmp0 (a, b) == 0)
    return;
  change = g_new0 (LaminaMaterialChange, 1);
  change->material_id = g_strdup (stored->id);
  change->stored = lamina_material_copy (stored);
  change->library = g_steal_pointer (&library);
  g_ptr_array_add (changes, change);
}

GPtrArray *
lamina_library_collect_material_changes (LaminaLibrary            *self,
                                         const LaminaConstruction *c)
{
  g_autoptr(GHashTable) seen = g_hash_table_new (g_str_hash, g_str_equal);
  GPtrArray *changes;

  changes = g_ptr_array_new_with_free_func ((GDestroyNotify) lamina_material_change_free);
  for (guint i = 0; i < c->layers->len; i++)
    {
      const LaminaLayer *layer = c->layers->pdata[i];

      compare_material (self, layer->material, seen, changes);
      for (guint k = 0; layer->parts && k < layer->parts->len; k++)
        compare_material (self, ((LaminaPart *) layer->parts->pdata[k])->material, seen, changes);
    }
  return changes;
}

GPtrArray *
lamina_library_list_material_changes (LaminaLibrary  *self,
                                      const char     *id,
                                      GError        **error)
{
  g_autoptr(LaminaConstruction) c = lamina_library_dup_construction (self, id, 0, error);

  if (c == NULL)
    return NULL;
  return lamina_library_collect_material_changes (self, c);
}

static void
refresh_material (LaminaLibrary   *self,
                  LaminaMaterial **slot)
{
  LaminaMaterial *library;

  if (*slot == NULL || (*slot)->id == NULL)
    return;
  library = VT (self)->get_material (BE (self), (*slot)->id, NULL);
  if (library == NULL)
    return;
  lamina_material_free (*slot);
  *slot = library;
}

int
lamina_library_update_materials (LaminaLibrary  *self,
                                 const char     *id,
                                 int             base_revision,
                                 const char     *author,
                                 GError        **error)
{
  g_autoptr(LaminaConstruction) c = lamina_library_dup_construction (self, id, 0, error);

  if (c == NULL)
    return 0;
  if (base_revision > 0 && c->revision != base_revision)
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_STALE,
                   "“%s” was changed by someone else (revision %d is the latest, "
                   "not %d); nothing was changed", c->name, c->revision, base_revision);
      return 0;
    }
  for (guint i = 0; i < c->layers->len; i++)
    {
      LaminaLayer *layer = c->layers->pdata[i];

      refresh_material (self, &layer->material);
      for (guint k = 0; layer->parts && k < layer->parts->len; k++)
        refresh_material (self, &((LaminaPart *) layer->parts->pdata[k])->material);
    }
  if (c->moisture != NULL)
    {
      LaminaClimate *library = VT (self)->get_climate (BE (self), c->moisture->climate, NULL);

      if (library != NULL)
        {
          lamina_climate_free (c->moisture->climate_data);
          c->moisture->climate_data = library;
        }
    }
  if (!lamina_library_save_construction (self, c, c->revision, author, error))
    return 0;
  return c->revision;
}
