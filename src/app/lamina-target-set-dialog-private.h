/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-target-set-dialog-private.h: the dialog's instance and its rows,
 * for its own file and for tests (the widgets, typed). */
#pragma once

#include "lamina-target-set-dialog.h"

G_BEGIN_DECLS

/* One use of the table: its widgets (owned by the grid). */
typedef struct
{
  GtkEntry       *use;
  GtkEntry       *label;
  GtkDropDown    *element;    /* 0 any, then LaminaElement + 1 */
  GtkEntry       *max_u;
  GtkEntry       *min_frsi;
  GtkDropDown    *moisture;   /* LaminaMoistureCriterion */
  GtkCheckButton *ground;
  GtkButton      *remove;
  gboolean        removed;
} LaminaTargetRow;

struct _LaminaTargetSetDialog
{
  GtkWindow      parent_instance;

  /* template */
  GtkDropDown   *set_dropdown;
  GtkEntry      *id_entry;
  GtkEntry      *name_entry;
  GtkEntry      *source_entry;
  GtkGrid       *rows_grid;
  GtkLabel      *error_label;
  GtkButton     *save_button;

  /* owned */
  LaminaLibrary *library;
  GStrv          set_ids;     /* the dropdown's order; the last is "" = new */
  GPtrArray     *rows;        /* LaminaTargetRow* */
  char          *notes;       /* the shown set's notes, kept as they are */
  gboolean       is_new;
  gboolean       filling;
};

G_END_DECLS
