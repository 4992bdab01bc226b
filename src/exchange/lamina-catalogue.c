/* SPDX-License-Identifier: GPL-3.0-or-later */
/* LaminaCatalogue: the contents of one catalogue XML document, and the
 * file-level entry points of its reader and writer. */
#define G_LOG_DOMAIN "lamina-exchange"

#include "lamina-catalogue-private.h"

#include "lamina-file.h"

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
  gsize length;

  g_return_val_if_fail (path != NULL, NULL);

  /* The limit holds while reading, so that a pipe or a device
   * (/dev/zero) cannot grow without bound either. */
  data = lamina_file_read_limited (path, LAMINA_CATALOGUE_MAX_SIZE, &length, &local);
  if (data == NULL)
    {
      if (g_error_matches (local, LAMINA_FILE_ERROR, LAMINA_FILE_ERROR_TOO_BIG))
        g_set_error (error, LAMINA_XML_ERROR, LAMINA_XML_ERROR_MALFORMED,
                     "%s:1: %s", path, _("the document is larger than 256 MiB"));
      else
        g_set_error_literal (error, LAMINA_XML_ERROR, LAMINA_XML_ERROR_IO, local->message);
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
  /* A reader sees the old or the new file; "-" is standard output. */
  if (!lamina_file_write_contents (path, TRUE, text, length, &local))
    {
      g_set_error_literal (error, LAMINA_XML_ERROR, LAMINA_XML_ERROR_IO, local->message);
      return FALSE;
    }
  return TRUE;
}
