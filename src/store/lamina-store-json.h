/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-store-json.h: how a construction revision is stored, as JSON
 * (private to src/store).  The body holds the whole construction except
 * the library data (status, revision, who and when), which are columns. */
#pragma once

#include <glib.h>

#include "lamina-construction.h"

G_BEGIN_DECLS

char               *lamina_store_construction_to_json   (const LaminaConstruction *construction);
/* Returns NULL with LAMINA_LIBRARY_ERROR_CORRUPT if @json is not a body
 * this module wrote. */
LaminaConstruction *lamina_store_construction_from_json (const char               *json,
                                                         GError                  **error);
/* A stable text of the thermal data of a material: when a layer's
 * snapshot and the library's copy differ here, the construction is
 * flagged "material data changed since review". */
char               *lamina_store_material_fingerprint   (const LaminaMaterial     *material);
/* The same for a climate's twelve months (name and source left out): when
 * a construction's copy and the library's differ here, it is flagged. */
char               *lamina_store_climate_fingerprint    (const LaminaClimate      *climate);
/* A climate's months as the climate table stores them, and back (into
 * @climate; FALSE if @json is not twelve of each). */
char               *lamina_store_climate_months_to_json (const LaminaClimate      *climate);
gboolean            lamina_store_climate_months_from_json (const char             *json,
                                                           LaminaClimate          *climate);

G_END_DECLS
