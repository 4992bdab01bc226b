/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "lamina-exchange"

#include "lamina-catalogue-materials.h"

#include <glib/gi18n-lib.h>

/* A material without an id (built in code, never stored) is written under
 * this one. */
#define ANONYMOUS_ID "material"

typedef struct
{
  const LaminaMaterial *material;  /* borrowed */
  char                 *id;
  char                 *snapshot_of;
} Row;

struct _LaminaMaterialIds
{
  GPtrArray  *rows;        /* Row*, owned, in writing order */
  GHashTable *by_id;       /* document id → Row* */
  GHashTable *by_material; /* layer's LaminaMaterial* → Row* */
};

typedef void (*VisitFunc) (LaminaMaterialIds    *ids,
                           const LaminaMaterial *material);

static void
row_free (Row *row)
{
  g_free (row->id);
  g_free (row->snapshot_of);
  g_free (row);
}

static Row *
add_row (LaminaMaterialIds    *ids,
         const LaminaMaterial *material,
         const char           *id,
         const char           *snapshot_of)
{
  Row *row = g_new0 (Row, 1);

  row->material = material;
  row->id = g_strdup (id);
  row->snapshot_of = g_strdup (snapshot_of);
  g_ptr_array_add (ids->rows, row);
  g_hash_table_insert (ids->by_id, row->id, row);
  return row;
}

/* Same design data, whatever the ids. */
static gboolean
same_data (const LaminaMaterial *a,
           const LaminaMaterial *b)
{
  LaminaMaterial tmp = *b;

  tmp.id = a->id;
  return lamina_material_equal (a, &tmp);
}

static void
visit_materials (LaminaMaterialIds     *ids,
                 const LaminaCatalogue *catalogue,
                 VisitFunc              func)
{
  for (guint i = 0; i < catalogue->constructions->len; i++)
    {
      const LaminaConstruction *c = catalogue->constructions->pdata[i];

      for (guint l = 0; l < c->layers->len; l++)
        {
          const LaminaLayer *layer = c->layers->pdata[l];

          if (layer->kind == LAMINA_LAYER_MATERIAL && layer->material != NULL)
            func (ids, layer->material);
          for (guint p = 0; layer->kind == LAMINA_LAYER_BRIDGED && layer->parts && p < layer->parts->len; p++)
            {
              const LaminaPart *part = layer->parts->pdata[p];

              if (part->material != NULL)
                func (ids, part->material);
            }
        }
    }
}

static void
add_library_material (LaminaMaterialIds    *ids,
                      const LaminaMaterial *material)
{
  const char *id = material->id ? material->id : ANONYMOUS_ID;

  if (!g_hash_table_contains (ids->by_id, id))
    add_row (ids, material, id, NULL);
}

static void
assign_material (LaminaMaterialIds    *ids,
                 const LaminaMaterial *material)
{
  const char *id = material->id ? material->id : ANONYMOUS_ID;
  Row *row = g_hash_table_lookup (ids->by_id, id);

  for (guint n = 2; !same_data (row->material, material); n++)
    {
      g_autofree char *name = g_strdup_printf ("%s~%u", id, n);
      Row *candidate = g_hash_table_lookup (ids->by_id, name);

      if (candidate == NULL)
        row = add_row (ids, material, name, id);
      else if (g_strcmp0 (candidate->snapshot_of, id) == 0)
        row = candidate; /* the loop ends if it holds the same data */
    }
  g_hash_table_insert (ids->by_material, (gpointer) material, row);
}

LaminaMaterialIds *
lamina_material_ids_new (const LaminaCatalogue *catalogue,
                         GError               **error)
{
  LaminaMaterialIds *ids = g_new0 (LaminaMaterialIds, 1);

  ids->rows = g_ptr_array_new_with_free_func ((GDestroyNotify) row_free);
  ids->by_id = g_hash_table_new (g_str_hash, g_str_equal);
  ids->by_material = g_hash_table_new (NULL, NULL);

  for (guint i = 0; i < catalogue->materials->len; i++)
    {
      const LaminaMaterial *m = catalogue->materials->pdata[i];

      if (m->id == NULL || g_hash_table_contains (ids->by_id, m->id))
        {
          g_set_error (error, LAMINA_XML_ERROR, LAMINA_XML_ERROR_INVALID,
                       m->id ? _("material “%s” appears twice in the catalogue")
                             : _("a library material has no id%s"),
                       m->id ? m->id : "");
          lamina_material_ids_free (ids);
          return NULL;
        }
      add_row (ids, m, m->id, NULL);
    }
  /* Every id gets its library row before any snapshot is named, so that
   * a snapshot name never takes an id that a later material needs. */
  visit_materials (ids, catalogue, add_library_material);
  visit_materials (ids, catalogue, assign_material);
  return ids;
}

void
lamina_material_ids_free (LaminaMaterialIds *ids)
{
  if (ids == NULL)
    return;
  g_hash_table_unref (ids->by_material);
  g_hash_table_unref (ids->by_id);
  g_ptr_array_unref (ids->rows);
  g_free (ids);
}

guint
lamina_material_ids_get_n (const LaminaMaterialIds *ids)
{
  return ids->rows->len;
}

const LaminaMaterial *
lamina_material_ids_get (const LaminaMaterialIds *ids,
                         guint                    index,
                         const char             **id,
                         const char             **snapshot_of)
{
  const Row *row = ids->rows->pdata[index];

  *id = row->id;
  *snapshot_of = row->snapshot_of;
  return row->material;
}

const char *
lamina_material_ids_lookup (const LaminaMaterialIds *ids,
                            const LaminaMaterial    *material)
{
  const Row *row = g_hash_table_lookup (ids->by_material, material);

  return row ? row->id : NULL;
}
