/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-material-chooser-private.h: the chooser's instance, for its own
 * file and for tests (the template's children, typed). */
#pragma once

#include "lamina-material-chooser.h"

G_BEGIN_DECLS

struct _LaminaMaterialChooser
{
  GtkWidget           parent_instance;

  /* template */
  GtkWidget          *box;
  GtkSearchEntry     *search;
  GtkListView        *list;
  GtkStringList      *names;      /* one string per material, in order */
  GtkStringFilter    *filter;
  GtkSingleSelection *selection;  /* over the search's filter */

  /* owned */
  GPtrArray          *materials;  /* LaminaMaterial * */
};

G_END_DECLS
