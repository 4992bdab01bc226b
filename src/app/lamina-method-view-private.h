/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-method-view-private.h: the view's instance, for its own file and
 * for tests (the fields, typed). */
#pragma once

#include "lamina-method-view.h"

#include "lamina-ground.h"

G_BEGIN_DECLS

/* One numeric field of the form: its entry and where its value lives. */
typedef enum
{
  NUM_AREA, NUM_PERIMETER, NUM_B_PRIME, NUM_WALL, NUM_SOIL_LAMBDA,
  NUM_UNDERFLOOR_HEIGHT, NUM_VENT_AREA, NUM_UNDERFLOOR_WALL_U, NUM_GROUND_WIND, NUM_SHIELDING,
  NUM_DEPTH, NUM_BASEMENT_WALL_R,
  NUM_THICKNESS_MAX,
  NUM_INNER_AREA, NUM_OUTER_AREA, NUM_OUTER_U, NUM_AIR_CHANGE, NUM_VOLUME,
  NUM_WIND, NUM_EMISSIVITY_INSIDE, NUM_EMISSIVITY_OUTSIDE,
  N_NUMS
} NumField;

struct _LaminaMethodView
{
  GtkWidget       parent_instance;

  /* template */
  GtkWidget      *scroller;
  GtkLabel       *error;
  GtkCheckButton *on_ground;
  GtkLabel       *ground_u;
  GtkGrid        *ground_table;
  GtkWidget      *ground_grid;
  GtkDropDown    *ground_kind;
  GtkDropDown    *soil;
  GtkEntry       *nums[N_NUMS];
  GtkWidget      *suspended_labels[5];
  GtkWidget      *basement_labels[2];
  GtkDropDown    *tapered_layer;
  GtkStringList  *layer_names;
  GtkDropDown    *taper;
  GtkLabel       *taper_u;
  GtkDropDown    *unheated;
  GtkWidget      *roof_label;
  GtkDropDown    *roof;
  GtkWidget      *other_labels[5];
  GtkCheckButton *air_profile;
  /* inside ground_table, made in init (a column per B′ of the table) */
  GtkLabel       *table_u[LAMINA_GROUND_TABLE_ROWS];

  /* owned */
  LaminaDocument *document;
  gboolean        updating;
};

G_END_DECLS
