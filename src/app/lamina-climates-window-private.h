/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-climates-window-private.h: the window's instance, for its own
 * file and for tests (the template children, typed). */
#pragma once

#include "lamina-climates-window.h"
#include "lamina-climate.h"

G_BEGIN_DECLS

struct _LaminaClimatesWindow
{
  GtkWindow      parent_instance;

  /* template */
  GtkListBox    *list;            /* one row per climate, in the order of ids */
  GtkEntry      *id_entry;
  GtkEntry      *name_entry;
  GtkEntry      *source_entry;
  GtkGrid       *months_grid;
  GtkLabel      *status;
  GtkProgressBar *progress;       /* pulses while a save re-flags the library */
  GtkWidget     *save_button;
  GtkWidget     *delete_button;
  GtkWidget     *new_button;

  /* built in code, one per month */
  GtkEntry      *temperature[LAMINA_MONTHS];
  GtkEntry      *humidity[LAMINA_MONTHS];

  /* owned */
  LaminaLibrary *library;
  GPtrArray     *ids;             /* char*, the climates of the rows */
  char          *shown_id;        /* the stored climate in the form, NULL for a new one */
  gboolean       saving;          /* a save runs in the worker */
  guint          pulse;
};

G_END_DECLS
