/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-material-row-private.h: the row's instance, for its own file and
 * for tests (the template children, typed). */
#pragma once

#include "lamina-material-row.h"

G_BEGIN_DECLS

struct _LaminaMaterialRow
{
  GtkListBoxRow   parent_instance;

  /* template */
  GtkDropDown    *category;
  GtkEntry       *name;
  GtkEntry       *lambda;
  GtkButton      *save;
  GtkEntry       *density;
  GtkEntry       *heat;
  GtkEntry       *mu;
  GtkEntry       *emissivity;
  GtkEntry       *source;
  GtkEntry       *notes;
  GtkEntry       *stock;
  GtkLabel       *error;

  /* owned */
  LaminaMaterial *material;  /* as last stored */
};

G_END_DECLS
