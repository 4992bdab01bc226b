/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-catalogue-materials.h: the ids under which the writer puts the
 * materials of a catalogue.
 *
 * Each library material is written once, under its id.  A layer keeps the
 * data it was calculated with; when that differs from the library material
 * of the same id (the library changed since), the layer's data is written
 * as a snapshot under a new id "ID~N" with snapshot-of="ID", and the reader
 * gives the layer back its library id and its own data. */
#pragma once

#include "lamina-catalogue.h"

G_BEGIN_DECLS

typedef struct _LaminaMaterialIds LaminaMaterialIds;

LaminaMaterialIds    *lamina_material_ids_new    (const LaminaCatalogue *catalogue,
                                                  GError               **error);
void                  lamina_material_ids_free   (LaminaMaterialIds     *ids);
guint                 lamina_material_ids_get_n  (const LaminaMaterialIds *ids);
/* Row @index in writing order: the material, its id in the document and,
 * for a snapshot, the library id (else NULL). */
const LaminaMaterial *lamina_material_ids_get    (const LaminaMaterialIds *ids,
                                                  guint                  index,
                                                  const char           **id,
                                                  const char           **snapshot_of);
/* The document id of a material used by a layer or part of the catalogue. */
const char           *lamina_material_ids_lookup (const LaminaMaterialIds *ids,
                                                  const LaminaMaterial   *material);

G_END_DECLS
