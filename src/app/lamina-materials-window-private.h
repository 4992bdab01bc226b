/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-materials-window-private.h: the window's instance, for its own
 * file and for tests (the template children, typed). */
#pragma once

#include "lamina-materials-window.h"
#include "lamina-material-row.h"

G_BEGIN_DECLS

struct _LaminaMaterialsWindow
{
  GtkWindow      parent_instance;

  /* template */
  GtkListBox    *list;    /* LaminaMaterialRow, one per material */
  GtkLabel      *status;
  GtkProgressBar *progress; /* pulses while a save re-flags the library */

  /* owned */
  LaminaLibrary *library;
  LaminaMaterialRow *saving_row; /* the row being saved, or NULL */
  guint          pulse;
};

G_END_DECLS
