/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "lamina-app"

#include "lamina-construction-item.h"

struct _LaminaConstructionItem
{
  GObject        parent_instance;

  /* owned */
  LaminaSummary *summary;
};

G_DEFINE_FINAL_TYPE (LaminaConstructionItem, lamina_construction_item, G_TYPE_OBJECT)

static void
lamina_construction_item_finalize (GObject *object)
{
  LaminaConstructionItem *self = LAMINA_CONSTRUCTION_ITEM (object);

  g_clear_pointer (&self->summary, lamina_summary_free);

  G_OBJECT_CLASS (lamina_construction_item_parent_class)->finalize (object);
}

static void
lamina_construction_item_class_init (LaminaConstructionItemClass *klass)
{
  G_OBJECT_CLASS (klass)->finalize = lamina_construction_item_finalize;
}

static void
lamina_construction_item_init (LaminaConstructionItem *self)
{
}

LaminaConstructionItem *
lamina_construction_item_new (LaminaSummary *summary)
{
  LaminaConstructionItem *self;

  g_return_val_if_fail (summary != NULL, NULL);

  self = g_object_new (LAMINA_TYPE_CONSTRUCTION_ITEM, NULL);
  self->summary = summary;
  return self;
}

const LaminaSummary *
lamina_construction_item_get_summary (LaminaConstructionItem *self)
{
  g_return_val_if_fail (LAMINA_IS_CONSTRUCTION_ITEM (self), NULL);
  return self->summary;
}

const char *
lamina_construction_item_get_id (LaminaConstructionItem *self)
{
  g_return_val_if_fail (LAMINA_IS_CONSTRUCTION_ITEM (self), NULL);
  return self->summary->id;
}
