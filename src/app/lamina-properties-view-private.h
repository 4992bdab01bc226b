/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-properties-view-private.h: the view's instance, for its own file
 * and for tests (the template children, typed). */
#pragma once

#include "lamina-properties-view.h"

G_BEGIN_DECLS

struct _LaminaPropertiesView
{
  GtkWidget       parent_instance;

  /* template */
  GtkWidget      *scroller;
  GtkDropDown    *element_dropdown;
  GtkDropDown    *heat_flow_dropdown;
  GtkLabel       *surface_label;
  GtkDropDown    *outer_side_dropdown;
  GtkEntry       *description_entry;
  GtkFlowBox     *tag_box;
  GtkEntry       *tag_entry;
  GtkLabel       *tag_error;
  GtkTextView    *notes_view;
  GtkLabel       *field_error;

  /* owned */
  LaminaDocument *document;
  GtkStringList  *heat_flows;
  GStrv           shown_tags;
  guint           notes_timeout;
  guint           notes_serial;
  int             shown_element;
  gboolean        updating;
};

G_END_DECLS
