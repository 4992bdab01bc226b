/* SPDX-License-Identifier: GPL-3.0-or-later */
/* LaminaCatalogue: the contents of one catalogue XML document, and the
 * file-level entry points of its reader and writer. */
#define G_LOG_DOMAIN "lamina-exchange"

#include "lamina-catalogue-private.h"

#include <errno.h>
#include <glib/gi18n-lib.h>
#include <glib/gstdio.h>
#include <math.h>

G_DEFINE_QUARK (lamina-xml-error-quark, lamina_xml_error)

LaminaCatalogue *
lamina_catalogue_new (void)
{
  LaminaCatalogue *catalogue = g_new0 (LaminaCatalogue, 1);

  catalogue->materials = g_ptr_array_new_with_free_func ((GDestroyNotify) lamina_material_free);
  catalogue->climates = g_ptr_array_new_with_free_func ((GDestroyNotify) lamina_climate_free);
  catalogue->constructions = g_ptr_array_new_with_free_func ((GDestroyNotify) lamina_construction_free);
  catalogue->target_sets = g_ptr_array_new_with_free_func ((GDestroyNotify) lamina_target_set_free);
  catalogue->jobs = g_ptr_array_new_with_free_func ((GDestroyNotify) lamina_job_free);
  return catalogue;
}

void
lamina_catalogue_free (LaminaCatalogue *catalogue)
{
  if (catalogue == NULL)
    return;
  g_free (catalogue->title);
  g_ptr_array_unref (catalogue->materials);
  g_ptr_array_unref (catalogue->climates);
  g_ptr_array_unref (catalogue->constructions);
  g_ptr_array_unref (catalogue->target_sets);
  g_ptr_array_unref (catalogue->jobs);
  g_free (catalogue);
}

LaminaConstruction *
lamina_catalogue_find (const LaminaCatalogue *catalogue,
                       const char            *id)
{
  g_return_val_if_fail (catalogue != NULL, NULL);
  g_return_val_if_fail (id != NULL, NULL);

  for (guint i = 0; i < catalogue->constructions->len; i++)
    {
      LaminaConstruction *c = catalogue->constructions->pdata[i];

      if (g_strcmp0 (c->id, id) == 0)
        return c;
    }
  return NULL;
}

LaminaMaterial *
lamina_catalogue_find_material (const LaminaCatalogue *catalogue,
                                const char            *id)
{
  g_return_val_if_fail (catalogue != NULL, NULL);
  g_return_val_if_fail (id != NULL, NULL);

  for (guint i = 0; i < catalogue->materials->len; i++)
    {
      LaminaMaterial *m = catalogue->materials->pdata[i];

      if (g_strcmp0 (m->id, id) == 0)
        return m;
    }
  return NULL;
}

LaminaTargetSet *
lamina_catalogue_find_target_set (const LaminaCatalogue *catalogue,
                                  const char            *id)
{
  g_return_val_if_fail (catalogue != NULL, NULL);

  for (guint i = 0; id != NULL && i < catalogue->target_sets->len; i++)
    {
      LaminaTargetSet *set = catalogue->target_sets->pdata[i];

      if (g_strcmp0 (set->id, id) == 0)
        return set;
    }
  return NULL;
}

LaminaJob *
lamina_catalogue_find_job (const LaminaCatalogue *catalogue,
                           const char            *id)
{
  g_return_val_if_fail (catalogue != NULL, NULL);

  for (guint i = 0; id != NULL && i < catalogue->jobs->len; i++)
    {
      LaminaJob *job = catalogue->jobs->pdata[i];

      if (g_strcmp0 (job->id, id) == 0)
        return job;
    }
  return NULL;
}

LaminaClimate *
lamina_catalogue_find_climate (const LaminaCatalogue *catalogue,
                               const char            *id)
{
  g_return_val_if_fail (catalogue != NULL, NULL);
  g_return_val_if_fail (id != NULL, NULL);

  for (guint i = 0; i < catalogue->climates->len; i++)
    {
      LaminaClimate *climate = catalogue->climates->pdata[i];

      if (g_strcmp0 (climate->id, id) == 0)
        return climate;
    }
  return NULL;
}

static gboolean
check_vapour (const LaminaMaterial *material,
              int                   line,
              guint                 number,
              int                  *out_line,
              GError              **error)
{
  if (material == NULL || isfinite (material->vapour_resistance_factor))
    return TRUE;
  *out_line = line;
  g_set_error (error, LAMINA_XML_ERROR, LAMINA_XML_ERROR_INVALID,
               _("layer %u: material “%s” has no vapour-resistance-factor, which <moisture> needs "
                 "(or give the layer an sd)"), number, material->id);
  return FALSE;
}

gboolean
lamina_catalogue_check_moisture (const LaminaCatalogue    *catalogue,
                                 const LaminaConstruction *construction,
                                 int                      *line,
                                 GError                  **error)
{
  const LaminaConstruction *c = construction;
  int dummy;

  g_return_val_if_fail (catalogue != NULL && c != NULL, FALSE);

  line = line != NULL ? line : &dummy;
  *line = 0;
  if (c->moisture == NULL)
    return TRUE;
  if (lamina_catalogue_find_climate (catalogue, c->moisture->climate) == NULL)
    {
      *line = c->moisture->line;
      g_set_error (error, LAMINA_XML_ERROR, LAMINA_XML_ERROR_INVALID,
                   _("unknown climate “%s”"), c->moisture->climate);
      return FALSE;
    }
  for (guint i = 0; i < c->layers->len; i++)
    {
      const LaminaLayer *layer = c->layers->pdata[i];

      if (!isnan (layer->sd))
        continue;
      if (!check_vapour (layer->material, layer->line, i + 1, line, error))
        return FALSE;
      for (guint p = 0; layer->parts != NULL && p < layer->parts->len; p++)
        {
          const LaminaPart *part = layer->parts->pdata[p];

          if (!check_vapour (part->material, part->line ? part->line : layer->line, i + 1, line, error))
            return FALSE;
        }
    }
  return TRUE;
}

LaminaCatalogue *
lamina_catalogue_read_file (const char  *path,
                            GError     **error)
{
  g_autofree char *data = NULL;
  g_autoptr(GError) local = NULL;
  GStatBuf st;
  gsize length;

  g_return_val_if_fail (path != NULL, NULL);

  /* Refuse a huge file before reading it into memory. */
  if (g_stat (path, &st) == 0 && (guint64) st.st_size > LAMINA_CATALOGUE_MAX_SIZE)
    {
      g_set_error (error, LAMINA_XML_ERROR, LAMINA_XML_ERROR_MALFORMED,
                   "%s:1: %s", path, _("the document is larger than 256 MiB"));
      return NULL;
    }
  if (!g_file_get_contents (path, &data, &length, &local))
    {
      /* GFileError messages already name the file. */
      g_set_error (error, LAMINA_XML_ERROR, LAMINA_XML_ERROR_IO, "%s", local->message);
      return NULL;
    }
  return lamina_catalogue_read_memory (data, length, path, error);
}

gboolean
lamina_catalogue_write_file (const LaminaCatalogue *catalogue,
                             const char            *path,
                             LaminaWriteFlags       flags,
                             GError               **error)
{
  g_autofree char *text = NULL;
  g_autoptr(GError) local = NULL;
  gsize length;

  g_return_val_if_fail (catalogue != NULL, FALSE);
  g_return_val_if_fail (path != NULL, FALSE);

  text = lamina_catalogue_write_to_string (catalogue, flags, &length, error);
  if (text == NULL)
    return FALSE;
  /* g_file_set_contents writes a temporary file beside @path, syncs it
   * and renames it over @path: a reader sees the old or the new file. */
  if (!g_file_set_contents_full (path, text, (gssize) length,
                                 G_FILE_SET_CONTENTS_CONSISTENT, 0666, &local))
    {
      g_set_error (error, LAMINA_XML_ERROR, LAMINA_XML_ERROR_IO, "%s", local->message);
      return FALSE;
    }
  return TRUE;
}
