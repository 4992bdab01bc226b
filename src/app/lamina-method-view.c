/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "lamina-app"

#include "config.h"

#include "lamina-method-view-private.h"

#include <glib/gi18n.h>
#include <math.h>

#include "lamina-editor-state.h"
#include "lamina-text.h"

G_DEFINE_FINAL_TYPE (LaminaMethodView, lamina_method_view, GTK_TYPE_WIDGET)

static const LaminaConstruction *
get_state (LaminaMethodView *self)
{
  return self->document ? lamina_document_get_construction (self->document) : NULL;
}

/* @error is read after @next is computed: the caller passes the address
 * of the GError the edit fills. */
static void
apply (LaminaMethodView   *self,
       LaminaConstruction *next,
       GError            **error)
{
  gboolean refused = next == NULL && *error != NULL;

  gtk_label_set_text (self->error, refused ? (*error)->message : "");
  gtk_widget_set_visible (GTK_WIDGET (self->error), refused);
  if (next != NULL)
    lamina_document_apply (self->document, next, NULL, LAMINA_APPLY_DEFAULT);
}

/* Blank is "not given" (NAN); otherwise a number with a decimal comma or
 * point.  FALSE (and the field marked) for anything else. */
static gboolean
read_number (LaminaMethodView *self,
             NumField          field,
             double           *value)
{
  g_autofree char *text = g_strstrip (g_strdup (gtk_editable_get_text (GTK_EDITABLE (self->nums[field]))));
  char *end = NULL;
  double v;

  gtk_widget_remove_css_class (GTK_WIDGET (self->nums[field]), "error");
  if (*text == '\0')
    {
      *value = NAN;
      return TRUE;
    }
  g_strdelimit (text, ",", '.');
  v = g_ascii_strtod (text, &end);
  if (end == text || *end != '\0' || !isfinite (v))
    {
      g_autofree char *message = g_strdup_printf (_("“%s” is not a number"), text);

      gtk_widget_add_css_class (GTK_WIDGET (self->nums[field]), "error");
      gtk_label_set_text (self->error, message);
      gtk_widget_set_visible (GTK_WIDGET (self->error), TRUE);
      return FALSE;
    }
  *value = v;
  return TRUE;
}

static void
set_number (LaminaMethodView *self,
            NumField          field,
            double            value)
{
  /* The shortest form, in the locale's notation (read_number takes both). */
  g_autofree char *text = isnan (value) ? g_strdup ("") : g_strdup_printf ("%g", value);

  if (g_strcmp0 (text, gtk_editable_get_text (GTK_EDITABLE (self->nums[field]))) != 0)
    gtk_editable_set_text (GTK_EDITABLE (self->nums[field]), text);
  gtk_widget_remove_css_class (GTK_WIDGET (self->nums[field]), "error");
}

/* Ground */

static void
commit_ground (LaminaMethodView *self,
               gboolean          from_b_prime)
{
  const LaminaConstruction *state = get_state (self);
  g_autoptr(GError) error = NULL;
  LaminaGround g;
  double b_prime, soil_lambda;
  guint soil;

  if (self->updating || state == NULL)
    return;
  if (!gtk_check_button_get_active (self->on_ground))
    {
      if (state->has_ground)
        apply (self, lamina_edit_set_ground (state, NULL, &error), &error);
      return;
    }
  if (state->has_ground)
    g = state->ground;
  else
    lamina_edit_default_ground (&g);
  g.kind = (LaminaGroundKind) MIN (gtk_drop_down_get_selected (self->ground_kind), LAMINA_N_GROUND_KINDS - 1);
  soil = gtk_drop_down_get_selected (self->soil);
  g.soil = (LaminaSoil) MIN (soil, LAMINA_N_SOILS - 1);
  if (state->has_ground
      && !(read_number (self, NUM_AREA, &g.area) && read_number (self, NUM_PERIMETER, &g.perimeter)
           && read_number (self, NUM_B_PRIME, &b_prime) && read_number (self, NUM_WALL, &g.wall_thickness)
           && read_number (self, NUM_SOIL_LAMBDA, &soil_lambda)
           && read_number (self, NUM_UNDERFLOOR_HEIGHT, &g.underfloor_height)
           && read_number (self, NUM_VENT_AREA, &g.vent_area)
           && read_number (self, NUM_UNDERFLOOR_WALL_U, &g.underfloor_wall_u)
           && read_number (self, NUM_GROUND_WIND, &g.wind_speed)
           && read_number (self, NUM_SHIELDING, &g.shielding_factor)
           && read_number (self, NUM_DEPTH, &g.depth)
           && read_number (self, NUM_BASEMENT_WALL_R, &g.basement_wall_resistance)))
    return;
  if (state->has_ground)
    {
      /* A soil class chosen in the list stands for its λ; a λ typed
       * overrides it. */
      g.soil_conductivity = soil_lambda;
      if (state->ground.soil != g.soil)
        g.soil_conductivity = NAN;
      /* B′ typed: keep P, set A = B′·P/2 (EN ISO 13370 8.1). */
      if (from_b_prime && !isnan (b_prime) && !isnan (g.perimeter))
        g.area = b_prime * g.perimeter / 2.0;
    }
  apply (self, lamina_edit_set_ground (state, &g, &error), &error);
}

static void
on_ground_changed_cb (LaminaMethodView *self)
{
  commit_ground (self, FALSE);
}

static void
on_b_prime_activate_cb (LaminaMethodView *self)
{
  commit_ground (self, TRUE);
}

/* Tapered layer: item 0 is "none", item i is layer i. */
static void
on_taper_changed_cb (LaminaMethodView *self)
{
  const LaminaConstruction *state = get_state (self);
  g_autoptr(GError) error = NULL;
  guint item = gtk_drop_down_get_selected (self->tapered_layer);
  guint shape = gtk_drop_down_get_selected (self->taper);
  double thick;
  int index = item == GTK_INVALID_LIST_POSITION ? -1 : (int) item - 1;

  if (self->updating || state == NULL || !read_number (self, NUM_THICKNESS_MAX, &thick))
    return;
  if (index >= 0 && isnan (thick))
    thick = ((LaminaLayer *) state->layers->pdata[index])->thickness * 2;
  apply (self, lamina_edit_set_taper (state, index, (LaminaTaper) (MIN (shape, 2u) + 1), thick, &error), &error);
}

static void
on_unheated_changed_cb (LaminaMethodView *self)
{
  const LaminaConstruction *state = get_state (self);
  g_autoptr(GError) error = NULL;
  LaminaUnheated u;

  if (self->updating || state == NULL)
    return;
  u = state->unheated;
  u.kind = (LaminaUnheatedKind) MIN (gtk_drop_down_get_selected (self->unheated), LAMINA_N_UNHEATED_KINDS - 1);
  u.roof = (LaminaRoofType) MIN (gtk_drop_down_get_selected (self->roof), LAMINA_N_ROOF_TYPES - 1);
  if (!(read_number (self, NUM_INNER_AREA, &u.inner_area) && read_number (self, NUM_OUTER_AREA, &u.outer_area)
        && read_number (self, NUM_OUTER_U, &u.outer_u) && read_number (self, NUM_AIR_CHANGE, &u.air_change)
        && read_number (self, NUM_VOLUME, &u.volume)))
    return;
  apply (self, lamina_edit_set_unheated (state, &u, &error), &error);
}

static void
on_surfaces_changed_cb (LaminaMethodView *self)
{
  const LaminaConstruction *state = get_state (self);
  g_autoptr(GError) error = NULL;
  LaminaSurfaceConditions s;

  if (self->updating || state == NULL)
    return;
  s = state->surfaces;
  s.air_from_profile = gtk_check_button_get_active (self->air_profile);
  if (!(read_number (self, NUM_WIND, &s.wind_speed)
        && read_number (self, NUM_EMISSIVITY_INSIDE, &s.emissivity_inside)
        && read_number (self, NUM_EMISSIVITY_OUTSIDE, &s.emissivity_outside)))
    return;
  apply (self, lamina_edit_set_surfaces (state, &s, &error), &error);
}

static void
lamina_method_view_dispose (GObject *object)
{
  LaminaMethodView *self = LAMINA_METHOD_VIEW (object);

  gtk_widget_dispose_template (GTK_WIDGET (self), LAMINA_TYPE_METHOD_VIEW);
  g_clear_object (&self->document);
  G_OBJECT_CLASS (lamina_method_view_parent_class)->dispose (object);
}

#define NUM(field) (G_STRUCT_OFFSET (LaminaMethodView, nums) + (field) * (gssize) sizeof (GtkEntry *))
#define LABEL(array, i) (G_STRUCT_OFFSET (LaminaMethodView, array) + (i) * (gssize) sizeof (GtkWidget *))

/* The template's children that live in the instance's arrays. */
static const struct
{
  const char *id;
  gssize      offset;
} array_children[] = {
  { "num_area", NUM (NUM_AREA) },
  { "num_perimeter", NUM (NUM_PERIMETER) },
  { "num_b_prime", NUM (NUM_B_PRIME) },
  { "num_wall", NUM (NUM_WALL) },
  { "num_soil_lambda", NUM (NUM_SOIL_LAMBDA) },
  { "num_underfloor_height", NUM (NUM_UNDERFLOOR_HEIGHT) },
  { "num_vent_area", NUM (NUM_VENT_AREA) },
  { "num_underfloor_wall_u", NUM (NUM_UNDERFLOOR_WALL_U) },
  { "num_ground_wind", NUM (NUM_GROUND_WIND) },
  { "num_shielding", NUM (NUM_SHIELDING) },
  { "num_depth", NUM (NUM_DEPTH) },
  { "num_basement_wall_r", NUM (NUM_BASEMENT_WALL_R) },
  { "num_thickness_max", NUM (NUM_THICKNESS_MAX) },
  { "num_inner_area", NUM (NUM_INNER_AREA) },
  { "num_outer_area", NUM (NUM_OUTER_AREA) },
  { "num_outer_u", NUM (NUM_OUTER_U) },
  { "num_air_change", NUM (NUM_AIR_CHANGE) },
  { "num_volume", NUM (NUM_VOLUME) },
  { "num_wind", NUM (NUM_WIND) },
  { "num_emissivity_inside", NUM (NUM_EMISSIVITY_INSIDE) },
  { "num_emissivity_outside", NUM (NUM_EMISSIVITY_OUTSIDE) },
  { "underfloor_height_label", LABEL (suspended_labels, 0) },
  { "vent_area_label", LABEL (suspended_labels, 1) },
  { "underfloor_wall_u_label", LABEL (suspended_labels, 2) },
  { "ground_wind_label", LABEL (suspended_labels, 3) },
  { "shielding_label", LABEL (suspended_labels, 4) },
  { "depth_label", LABEL (basement_labels, 0) },
  { "basement_wall_r_label", LABEL (basement_labels, 1) },
  { "inner_area_label", LABEL (other_labels, 0) },
  { "outer_area_label", LABEL (other_labels, 1) },
  { "outer_u_label", LABEL (other_labels, 2) },
  { "air_change_label", LABEL (other_labels, 3) },
  { "volume_label", LABEL (other_labels, 4) },
};

#undef NUM
#undef LABEL

/* The entries beside those labels, in the same order. */
static const NumField suspended_fields[] = { NUM_UNDERFLOOR_HEIGHT, NUM_VENT_AREA, NUM_UNDERFLOOR_WALL_U,
                                             NUM_GROUND_WIND, NUM_SHIELDING };
static const NumField basement_fields[] = { NUM_DEPTH, NUM_BASEMENT_WALL_R };
static const NumField other_fields[] = { NUM_INNER_AREA, NUM_OUTER_AREA, NUM_OUTER_U, NUM_AIR_CHANGE, NUM_VOLUME };

static void
lamina_method_view_class_init (LaminaMethodViewClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->dispose = lamina_method_view_dispose;
  gtk_widget_class_set_layout_manager_type (widget_class, GTK_TYPE_BIN_LAYOUT);
  gtk_widget_class_set_css_name (widget_class, "laminamethodview");
  gtk_widget_class_set_template_from_resource (widget_class, "/org/example/Lamina/lamina-method-view.ui");
  gtk_widget_class_bind_template_child (widget_class, LaminaMethodView, scroller);
  gtk_widget_class_bind_template_child (widget_class, LaminaMethodView, error);
  gtk_widget_class_bind_template_child (widget_class, LaminaMethodView, on_ground);
  gtk_widget_class_bind_template_child (widget_class, LaminaMethodView, ground_u);
  gtk_widget_class_bind_template_child (widget_class, LaminaMethodView, ground_table);
  gtk_widget_class_bind_template_child (widget_class, LaminaMethodView, ground_grid);
  gtk_widget_class_bind_template_child (widget_class, LaminaMethodView, ground_kind);
  gtk_widget_class_bind_template_child (widget_class, LaminaMethodView, soil);
  gtk_widget_class_bind_template_child (widget_class, LaminaMethodView, tapered_layer);
  gtk_widget_class_bind_template_child (widget_class, LaminaMethodView, layer_names);
  gtk_widget_class_bind_template_child (widget_class, LaminaMethodView, taper);
  gtk_widget_class_bind_template_child (widget_class, LaminaMethodView, taper_u);
  gtk_widget_class_bind_template_child (widget_class, LaminaMethodView, unheated);
  gtk_widget_class_bind_template_child (widget_class, LaminaMethodView, roof_label);
  gtk_widget_class_bind_template_child (widget_class, LaminaMethodView, roof);
  gtk_widget_class_bind_template_child (widget_class, LaminaMethodView, air_profile);
  for (guint i = 0; i < G_N_ELEMENTS (array_children); i++)
    gtk_widget_class_bind_template_child_full (widget_class, array_children[i].id, FALSE,
                                               array_children[i].offset);
  gtk_widget_class_bind_template_callback (widget_class, on_ground_changed_cb);
  gtk_widget_class_bind_template_callback (widget_class, on_b_prime_activate_cb);
  gtk_widget_class_bind_template_callback (widget_class, on_taper_changed_cb);
  gtk_widget_class_bind_template_callback (widget_class, on_unheated_changed_cb);
  gtk_widget_class_bind_template_callback (widget_class, on_surfaces_changed_cb);
}
static void
lamina_method_view_init (LaminaMethodView *self)
{
  self->updating = TRUE;
  gtk_widget_init_template (GTK_WIDGET (self));
  /* The table by B′ has a column per row of lamina_ground_table_b_prime. */
  for (guint i = 0; i < LAMINA_GROUND_TABLE_ROWS; i++)
    {
      g_autofree char *b = g_strdup_printf ("%g", lamina_ground_table_b_prime[i]);

      gtk_grid_attach (self->ground_table, gtk_label_new (b), (int) i + 1, 0, 1, 1);
      self->table_u[i] = GTK_LABEL (gtk_label_new (""));
      gtk_grid_attach (self->ground_table, GTK_WIDGET (self->table_u[i]), (int) i + 1, 1, 1, 1);
    }
  self->updating = FALSE;
}

void
lamina_method_view_set_document (LaminaMethodView *self,
                                 LaminaDocument   *document)
{
  g_return_if_fail (LAMINA_IS_METHOD_VIEW (self));
  g_set_object (&self->document, document);
}

/* The rows of one kind of floor or space: each label and its entry. */
static void
show_rows (LaminaMethodView *self,
           GtkWidget       **labels,
           const NumField   *fields,
           guint             n,
           gboolean          visible)
{
  for (guint i = 0; i < n; i++)
    {
      gtk_widget_set_visible (labels[i], visible);
      gtk_widget_set_visible (GTK_WIDGET (self->nums[fields[i]]), visible);
    }
}

static void
update_ground (LaminaMethodView         *self,
               const LaminaConstruction *state,
               const LaminaResult       *result)
{
  const LaminaGround *g = &state->ground;
  gboolean on = state->has_ground;
  char u[LAMINA_U_TEXT_SIZE];

  gtk_check_button_set_active (self->on_ground, on);
  gtk_widget_set_sensitive (GTK_WIDGET (self->on_ground), state->element == LAMINA_ELEMENT_FLOOR || on);
  gtk_widget_set_visible (self->ground_grid, on);
  gtk_widget_set_visible (GTK_WIDGET (self->ground_u), on);
  gtk_widget_set_visible (GTK_WIDGET (self->ground_table), on && result != NULL && result->has_ground);
  if (!on)
    return;
  gtk_drop_down_set_selected (self->ground_kind, g->kind);
  gtk_drop_down_set_selected (self->soil, g->soil);
  set_number (self, NUM_AREA, g->area);
  set_number (self, NUM_PERIMETER, g->perimeter);
  set_number (self, NUM_B_PRIME, g->area / (0.5 * g->perimeter));
  set_number (self, NUM_WALL, g->wall_thickness);
  set_number (self, NUM_SOIL_LAMBDA, g->soil_conductivity);
  set_number (self, NUM_UNDERFLOOR_HEIGHT, g->underfloor_height);
  set_number (self, NUM_VENT_AREA, g->vent_area);
  set_number (self, NUM_UNDERFLOOR_WALL_U, g->underfloor_wall_u);
  set_number (self, NUM_GROUND_WIND, g->wind_speed);
  set_number (self, NUM_SHIELDING, g->shielding_factor);
  set_number (self, NUM_DEPTH, g->depth);
  set_number (self, NUM_BASEMENT_WALL_R, g->basement_wall_resistance);
  show_rows (self, self->suspended_labels, suspended_fields, G_N_ELEMENTS (suspended_fields),
             g->kind == LAMINA_GROUND_SUSPENDED);
  show_rows (self, self->basement_labels, basement_fields, G_N_ELEMENTS (basement_fields),
             g->kind == LAMINA_GROUND_BASEMENT);
  if (result != NULL && result->has_ground)
    {
      double table[LAMINA_GROUND_TABLE_ROWS];
      g_autofree char *b = lamina_text_number (result->ground.b_prime, 2);
      g_autofree char *text = g_strdup_printf (_("U with the ground: %s W/(m²·K) for B′ %s m%s"),
                                               lamina_format_u (u, result->ground.u), b,
                                               result->ground.soil_assumed ? _(" (soil not known: λ 2.0 assumed)") : "");

      gtk_label_set_text (self->ground_u, text);
      lamina_result_ground_table (state, result, table);
      for (guint i = 0; i < LAMINA_GROUND_TABLE_ROWS; i++)
        gtk_label_set_text (self->table_u[i], lamina_format_u (u, table[i]));
    }
  else
    gtk_label_set_text (self->ground_u, "");
}

static void
update_taper (LaminaMethodView         *self,
              const LaminaConstruction *state,
              const LaminaResult       *result)
{
  guint selected = 0;
  const LaminaLayer *tapered = NULL;
  g_autoptr(GPtrArray) names = g_ptr_array_new_with_free_func (g_free);

  g_ptr_array_add (names, g_strdup (_("None")));
  for (guint i = 0; i < state->layers->len; i++)
    {
      const LaminaLayer *layer = state->layers->pdata[i];

      g_ptr_array_add (names, g_strdup_printf ("%u  %s", i + 1, lamina_layer_get_label (layer)));
      if (lamina_layer_is_tapered (layer))
        {
          selected = i + 1;
          tapered = layer;
        }
    }
  g_ptr_array_add (names, NULL);
  gtk_string_list_splice (self->layer_names, 0, g_list_model_get_n_items (G_LIST_MODEL (self->layer_names)),
                          (const char *const *) names->pdata);
  gtk_drop_down_set_selected (self->tapered_layer, selected);
  set_number (self, NUM_THICKNESS_MAX, tapered ? tapered->thickness_max : NAN);
  if (tapered)
    gtk_drop_down_set_selected (self->taper, tapered->taper - 1);
  gtk_widget_set_sensitive (GTK_WIDGET (self->nums[NUM_THICKNESS_MAX]), tapered != NULL);
  gtk_widget_set_sensitive (GTK_WIDGET (self->taper), tapered != NULL);
  if (tapered && result != NULL && result->tapered)
    {
      char a[LAMINA_U_TEXT_SIZE], b[LAMINA_U_TEXT_SIZE], c[LAMINA_U_TEXT_SIZE];
      g_autofree char *thin = lamina_text_mm (tapered->thickness);
      g_autofree char *thick = lamina_text_mm (tapered->thickness_max);
      g_autofree char *text = g_strdup_printf (_("%s to %s: U %s at the thin end, %s at the thick end; "
                                                 "area-average U %s W/(m²·K)"),
                                               thin, thick, lamina_format_u (a, result->u_thin_end),
                                               lamina_format_u (b, result->u_thick_end),
                                               lamina_format_u (c, result->u));

      gtk_label_set_text (self->taper_u, text);
    }
  else
    gtk_label_set_text (self->taper_u, "");
}

void
lamina_method_view_update (LaminaMethodView         *self,
                           const LaminaConstruction *state,
                           const LaminaResult       *result)
{
  const LaminaUnheated *u;
  const LaminaSurfaceConditions *s;

  g_return_if_fail (LAMINA_IS_METHOD_VIEW (self));

  if (state == NULL)
    return;
  self->updating = TRUE;
  /* A new state (an edit went through, or another construction): an old
   * refusal no longer applies. */
  gtk_widget_set_visible (GTK_WIDGET (self->error), FALSE);
  update_ground (self, state, result);
  update_taper (self, state, result);
  u = &state->unheated;
  gtk_drop_down_set_selected (self->unheated, u->kind);
  gtk_drop_down_set_selected (self->roof, u->roof);
  gtk_widget_set_visible (self->roof_label, u->kind == LAMINA_UNHEATED_ROOF_SPACE);
  gtk_widget_set_visible (GTK_WIDGET (self->roof), u->kind == LAMINA_UNHEATED_ROOF_SPACE);
  set_number (self, NUM_INNER_AREA, u->inner_area);
  set_number (self, NUM_OUTER_AREA, u->outer_area);
  set_number (self, NUM_OUTER_U, u->outer_u);
  set_number (self, NUM_AIR_CHANGE, u->air_change);
  set_number (self, NUM_VOLUME, u->volume);
  show_rows (self, self->other_labels, other_fields, G_N_ELEMENTS (other_fields), u->kind == LAMINA_UNHEATED_OTHER);
  s = &state->surfaces;
  set_number (self, NUM_WIND, s->wind_speed);
  set_number (self, NUM_EMISSIVITY_INSIDE, s->emissivity_inside);
  set_number (self, NUM_EMISSIVITY_OUTSIDE, s->emissivity_outside);
  gtk_check_button_set_active (self->air_profile, s->air_from_profile);
  self->updating = FALSE;
}

