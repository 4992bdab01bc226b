/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-progress-window-private.h: the instance, for its own file and for
 * tests (the template's children, typed). */
#pragma once

#include "lamina-progress-window.h"

G_BEGIN_DECLS

struct _LaminaProgressWindow
{
  GtkWindow       parent_instance;

  /* template */
  GtkLabel       *label;
  GtkProgressBar *bar;
  GtkButton      *cancel;

  /* owned */
  GCancellable   *cancellable;
};

G_END_DECLS
