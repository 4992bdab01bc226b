/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-construction-item.h: one row of the library list (a summary: no
 * layers), as a GObject for list models. */
#pragma once

#include <glib-object.h>

#include "store/lamina-library.h"

G_BEGIN_DECLS

#define LAMINA_TYPE_CONSTRUCTION_ITEM (lamina_construction_item_get_type ())
G_DECLARE_FINAL_TYPE (LaminaConstructionItem, lamina_construction_item, LAMINA, CONSTRUCTION_ITEM, GObject)

/* Takes @summary. */
LaminaConstructionItem *lamina_construction_item_new         (LaminaSummary          *summary);
const LaminaSummary    *lamina_construction_item_get_summary (LaminaConstructionItem *self);
const char             *lamina_construction_item_get_id      (LaminaConstructionItem *self);

G_END_DECLS
