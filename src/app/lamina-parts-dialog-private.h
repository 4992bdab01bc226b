/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-parts-dialog-private.h: the dialog's instance and its part rows,
 * for its own file and for tests (typed widgets, no string keys). */
#pragma once

#include "lamina-parts-dialog.h"

G_BEGIN_DECLS

/* One part of the layer: its widgets (built in code, one set per part). */
typedef struct
{
  LaminaPartsDialog *dialog;
  guint              part;
  GtkWidget         *box;
  GtkDropDown       *material;
  GtkDropDown       *mode;
  GtkWidget         *fraction_box;
  GtkEntry          *fraction;
  GtkWidget         *framing_box;
  GtkEntry          *width;
  GtkEntry          *spacing;
  GtkLabel          *remainder;
  GtkEntry          *member;
  GtkWidget         *remove;
  GtkLabel          *error;
  GPtrArray         *options;   /* LaminaMaterial* (NULL = air), owned */
} LaminaPartsRow;

struct _LaminaPartsDialog
{
  GtkWindow       parent_instance;

  /* template */
  GtkBox         *rows_box;
  GtkWidget      *add;
  GtkLabel       *layer_error;

  /* owned */
  LaminaDocument *document;
  guint           layer;
  GPtrArray      *rows;       /* LaminaPartsRow*, one per part */
  GPtrArray      *materials;  /* the library's, owned */
  gulong          changed_id;
  gboolean        updating;
};

G_END_DECLS
