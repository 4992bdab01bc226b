/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-change-banner-private.h: the instance, for the window tests. */
#pragma once

#include "lamina-change-banner.h"

G_BEGIN_DECLS

/* What the library holds of the open construction. */
typedef struct
{
  int           head;       /* latest revision, 0: unknown */
  LaminaStatus  status;
  guint         n_events;   /* review records */
} LaminaChangeState;

struct _LaminaChangeBanner
{
  GtkBox             parent_instance;

  /* template */
  GtkRevealer       *revealer;
  GtkLabel          *label;
  GtkButton         *reload_button;
  GtkButton         *keep_button;

  /* owned */
  LaminaDocument    *document;
  char              *message;
  LaminaChangeState  known;
};

G_END_DECLS
