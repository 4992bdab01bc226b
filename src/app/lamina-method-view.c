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

/* Building the form */

static GtkWidget *
add_heading (GtkBox     *box,
             const char *text)
{
  GtkWidget *label = gtk_label_new (text);

  gtk_label_set_xalign (GTK_LABEL (label), 0);
  gtk_widget_add_css_class (label, "heading");
  gtk_widget_set_margin_top (label, 12);
  gtk_box_append (box, label);
  return label;
}

static GtkWidget *
add_grid (GtkBox *box)
{
  GtkWidget *grid = gtk_grid_new ();

  gtk_grid_set_row_spacing (GTK_GRID (grid), 4);
  gtk_grid_set_column_spacing (GTK_GRID (grid), 8);
  gtk_box_append (box, grid);
  return grid;
}

static GtkWidget *
add_row_label (GtkGrid    *grid,
               int         row,
               const char *text)
{
  GtkWidget *label = gtk_label_new (text);

  gtk_label_set_xalign (GTK_LABEL (label), 0);
  gtk_label_set_wrap (GTK_LABEL (label), TRUE);
  gtk_label_set_max_width_chars (GTK_LABEL (label), 28);
  gtk_grid_attach (grid, label, 0, row, 1, 1);
  return label;
}

/* A numeric field committed on Enter and when focus leaves. */
static GtkWidget *
add_number (LaminaMethodView *self,
            GtkGrid          *grid,
            int               row,
            NumField          field,
            const char       *label,
            const char       *placeholder,
            GCallback         commit)
{
  GtkWidget *entry = gtk_entry_new ();
  GtkEventController *focus = gtk_event_controller_focus_new ();
  GtkWidget *name = add_row_label (grid, row, label);

  gtk_editable_set_width_chars (GTK_EDITABLE (entry), 9);
  if (placeholder != NULL)
    gtk_entry_set_placeholder_text (GTK_ENTRY (entry), placeholder);
  gtk_accessible_update_property (GTK_ACCESSIBLE (entry), GTK_ACCESSIBLE_PROPERTY_LABEL, label, -1);
  g_signal_connect_object (entry, "activate", commit, self, G_CONNECT_SWAPPED);
  g_signal_connect_object (focus, "leave", commit, self, G_CONNECT_SWAPPED);
  gtk_widget_add_controller (entry, focus);
  gtk_grid_attach (grid, entry, 1, row, 1, 1);
  self->nums[field] = GTK_ENTRY (entry);
  (void) name;
  return entry;
}

static GtkDropDown *
add_choice (LaminaMethodView   *self,
            GtkGrid            *grid,
            int                 row,
            const char         *label,
            const char *const  *items,
            GCallback           commit)
{
  GtkWidget *dropdown = gtk_drop_down_new_from_strings (items);

  add_row_label (grid, row, label);
  gtk_accessible_update_property (GTK_ACCESSIBLE (dropdown), GTK_ACCESSIBLE_PROPERTY_LABEL, label, -1);
  g_signal_connect_object (dropdown, "notify::selected", commit, self, G_CONNECT_SWAPPED);
  gtk_grid_attach (grid, dropdown, 1, row, 1, 1);
  return GTK_DROP_DOWN (dropdown);
}

static void
build_ground (LaminaMethodView *self,
              GtkBox           *box)
{
  const char *const kinds[] = { _("Slab on ground"), _("Suspended floor"), _("Heated basement"), NULL };
  const char *const soils[] = { _("Not known (λ 2.0 assumed)"), _("Clay or silt (λ 1.5)"),
                                _("Sand or gravel (λ 2.0)"), _("Homogeneous rock (λ 3.5)"), NULL };
  GCallback cb = G_CALLBACK (on_ground_changed_cb);
  GtkGrid *grid;
  int row = 0;

  add_heading (box, _("Ground floor, EN ISO 13370"));
  self->on_ground = GTK_CHECK_BUTTON (gtk_check_button_new_with_label (_("On or over the ground: state the plan")));
  g_signal_connect_object (self->on_ground, "toggled", cb, self, G_CONNECT_SWAPPED);
  gtk_box_append (box, GTK_WIDGET (self->on_ground));
  /* The answer first, then the plan it is for. */
  self->ground_u = GTK_LABEL (gtk_label_new (""));
  gtk_label_set_xalign (self->ground_u, 0);
  gtk_label_set_wrap (self->ground_u, TRUE);
  gtk_widget_add_css_class (GTK_WIDGET (self->ground_u), "heading");
  gtk_box_append (box, GTK_WIDGET (self->ground_u));
  self->ground_table = GTK_GRID (add_grid (box));
  gtk_grid_attach (self->ground_table, gtk_label_new (_("B′ m")), 0, 0, 1, 1);
  gtk_grid_attach (self->ground_table, gtk_label_new (_("U")), 0, 1, 1, 1);
  for (guint i = 0; i < LAMINA_GROUND_TABLE_ROWS; i++)
    {
      g_autofree char *b = g_strdup_printf ("%g", lamina_ground_table_b_prime[i]);

      gtk_grid_attach (self->ground_table, gtk_label_new (b), (int) i + 1, 0, 1, 1);
      self->table_u[i] = GTK_LABEL (gtk_label_new (""));
      gtk_grid_attach (self->ground_table, GTK_WIDGET (self->table_u[i]), (int) i + 1, 1, 1, 1);
    }
  self->ground_grid = add_grid (box);
  grid = GTK_GRID (self->ground_grid);
  self->ground_kind = add_choice (self, grid, row++, _("Kind"), kinds, cb);
  add_number (self, grid, row++, NUM_AREA, _("Floor area A, m²"), NULL, cb);
  add_number (self, grid, row++, NUM_PERIMETER, _("Exposed perimeter P, m"), NULL, cb);
  add_number (self, grid, row++, NUM_B_PRIME, _("or B′ = A/(0.5 P), m"), NULL, G_CALLBACK (on_b_prime_activate_cb));
  add_number (self, grid, row++, NUM_WALL, _("External wall thickness w, mm"), NULL, cb);
  self->soil = add_choice (self, grid, row++, _("Soil"), soils, cb);
  add_number (self, grid, row++, NUM_SOIL_LAMBDA, _("or soil λ, W/(m·K)"), _("by the soil"), cb);
  for (guint i = 0; i < 5; i++)
    {
      static const NumField fields[] = { NUM_UNDERFLOOR_HEIGHT, NUM_VENT_AREA, NUM_UNDERFLOOR_WALL_U,
                                         NUM_GROUND_WIND, NUM_SHIELDING };
      const char *labels[] = { _("Underfloor height h, m"), _("Vent area ε, m² per m of perimeter"),
                               _("Underfloor wall U, W/(m²·K)"), _("Wind speed v, m/s"),
                               _("Shielding factor fw") };
      const char *placeholders[] = { NULL, NULL, NULL, "4", "0.05" };

      self->suspended_rows[2 * i + 1] = add_number (self, grid, row, fields[i], labels[i], placeholders[i], cb);
      self->suspended_rows[2 * i] = gtk_grid_get_child_at (grid, 0, row++);
    }
  self->basement_rows[1] = add_number (self, grid, row, NUM_DEPTH, _("Basement depth z, m"), NULL, cb);
  self->basement_rows[0] = gtk_grid_get_child_at (grid, 0, row++);
  self->basement_rows[3] = add_number (self, grid, row, NUM_BASEMENT_WALL_R, _("Basement wall R, m²·K/W"),
                                       _("optional"), cb);
  self->basement_rows[2] = gtk_grid_get_child_at (grid, 0, row++);

}

static void
build_taper (LaminaMethodView *self,
             GtkBox           *box)
{
  const char *const shapes[] = { _("Rectangle, one fall"), _("Triangle, thickest at the apex"),
                                 _("Triangle, thinnest at the apex"), NULL };
  GCallback cb = G_CALLBACK (on_taper_changed_cb);
  GtkGrid *grid;
  GtkWidget *dropdown;

  add_heading (box, _("Tapered layer, EN ISO 6946 Annex E"));
  grid = GTK_GRID (add_grid (box));
  self->layer_names = gtk_string_list_new (NULL);
  dropdown = gtk_drop_down_new (G_LIST_MODEL (g_object_ref (self->layer_names)), NULL);
  add_row_label (grid, 0, _("Layer laid to falls"));
  gtk_accessible_update_property (GTK_ACCESSIBLE (dropdown), GTK_ACCESSIBLE_PROPERTY_LABEL,
                                  _("Layer laid to falls"), -1);
  g_signal_connect_object (dropdown, "notify::selected", cb, self, G_CONNECT_SWAPPED);
  gtk_grid_attach (grid, dropdown, 1, 0, 1, 1);
  self->tapered_layer = GTK_DROP_DOWN (dropdown);
  add_number (self, grid, 1, NUM_THICKNESS_MAX, _("Thick end, mm (the layer's thickness is the thin end)"), NULL, cb);
  self->taper = add_choice (self, grid, 2, _("Shape on plan"), shapes, cb);
  self->taper_u = GTK_LABEL (gtk_label_new (""));
  gtk_label_set_xalign (self->taper_u, 0);
  gtk_label_set_wrap (self->taper_u, TRUE);
  gtk_box_append (box, GTK_WIDGET (self->taper_u));
}

static void
build_unheated (LaminaMethodView *self,
                GtkBox           *box)
{
  const char *const kinds[] = { _("None: the outer surface faces outdoors"), _("Roof space"),
                                _("Other unheated space"), NULL };
  const char *const roofs[] = { _("Tiles, no felt or boards (Ru 0.06)"), _("Sheeted, or tiles on felt or boards (0.2)"),
                                _("As before, low-emissivity underside (0.3)"), _("Lined with boards and felt (0.3)"),
                                NULL };
  GCallback cb = G_CALLBACK (on_unheated_changed_cb);
  GtkGrid *grid;
  static const NumField fields[] = { NUM_INNER_AREA, NUM_OUTER_AREA, NUM_OUTER_U, NUM_AIR_CHANGE, NUM_VOLUME };

  add_heading (box, _("Unheated space outside, EN ISO 6946 6.10"));
  grid = GTK_GRID (add_grid (box));
  self->unheated = add_choice (self, grid, 0, _("Beyond the outer layer"), kinds, cb);
  self->roof = add_choice (self, grid, 1, _("Roof type"), roofs, cb);
  for (guint i = 0; i < 5; i++)
    {
      const char *labels[] = { _("Area to the heated space Ai, m²"), _("Area to outside Ae, m²"),
                               _("U to outside Ue, W/(m²·K)"), _("Air change n, 1/h"), _("Volume V, m³") };

      self->other_rows[2 * i + 1] = add_number (self, grid, (int) i + 2, fields[i], labels[i], NULL, cb);
      self->other_rows[2 * i] = gtk_grid_get_child_at (grid, 0, (int) i + 2);
    }
}

static void
build_surfaces (LaminaMethodView *self,
                GtkBox           *box)
{
  GCallback cb = G_CALLBACK (on_surfaces_changed_cb);
  GtkGrid *grid;

  add_heading (box, _("Surfaces and air layers, EN ISO 6946 Annexes C and D"));
  grid = GTK_GRID (add_grid (box));
  add_number (self, grid, 0, NUM_WIND, _("Wind speed, m/s"), _("Table 7"), cb);
  add_number (self, grid, 1, NUM_EMISSIVITY_INSIDE, _("Inner surface emissivity"), "0.9", cb);
  add_number (self, grid, 2, NUM_EMISSIVITY_OUTSIDE, _("Outer surface emissivity"), "0.9", cb);
  self->air_profile = GTK_CHECK_BUTTON (gtk_check_button_new_with_label (
    _("Air layers at the temperature difference of their own profile (ΔT > 5 K)")));
  g_signal_connect_object (self->air_profile, "toggled", cb, self, G_CONNECT_SWAPPED);
  gtk_box_append (box, GTK_WIDGET (self->air_profile));
}

static void
lamina_method_view_dispose (GObject *object)
{
  LaminaMethodView *self = LAMINA_METHOD_VIEW (object);

  g_clear_pointer (&self->scroller, gtk_widget_unparent);
  g_clear_object (&self->layer_names);
  g_clear_object (&self->document);
  G_OBJECT_CLASS (lamina_method_view_parent_class)->dispose (object);
}

static void
lamina_method_view_class_init (LaminaMethodViewClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->dispose = lamina_method_view_dispose;
  gtk_widget_class_set_layout_manager_type (widget_class, GTK_TYPE_BIN_LAYOUT);
  gtk_widget_class_set_css_name (widget_class, "laminamethodview");
}

static void
lamina_method_view_init (LaminaMethodView *self)
{
  GtkWidget *box = gtk_box_new (GTK_ORIENTATION_VERTICAL, 6);

  self->updating = TRUE;
  gtk_widget_set_margin_start (box, 12);
  gtk_widget_set_margin_end (box, 12);
  gtk_widget_set_margin_bottom (box, 12);
  self->error = GTK_LABEL (gtk_label_new (""));
  gtk_label_set_wrap (self->error, TRUE);
  gtk_label_set_xalign (self->error, 0);
  gtk_widget_add_css_class (GTK_WIDGET (self->error), "error");
  gtk_widget_set_visible (GTK_WIDGET (self->error), FALSE);
  gtk_box_append (GTK_BOX (box), GTK_WIDGET (self->error));
  build_ground (self, GTK_BOX (box));
  build_taper (self, GTK_BOX (box));
  build_unheated (self, GTK_BOX (box));
  build_surfaces (self, GTK_BOX (box));
  self->scroller = gtk_scrolled_window_new ();
  gtk_scrolled_window_set_policy (GTK_SCROLLED_WINDOW (self->scroller), GTK_POLICY_NEVER, GTK_POLICY_AUTOMATIC);
  gtk_scrolled_window_set_child (GTK_SCROLLED_WINDOW (self->scroller), box);
  gtk_widget_set_parent (self->scroller, GTK_WIDGET (self));
  self->updating = FALSE;
}

void
lamina_method_view_set_document (LaminaMethodView *self,
                                 LaminaDocument   *document)
{
  g_return_if_fail (LAMINA_IS_METHOD_VIEW (self));
  g_set_object (&self->document, document);
}

static void
show_rows (GtkWidget **rows,
           guint       n,
           gboolean    visible)
{
  for (guint i = 0; i < n; i++)
    if (rows[i] != NULL)
      gtk_widget_set_visible (rows[i], visible);
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
  show_rows (self->suspended_rows, G_N_ELEMENTS (self->suspended_rows), g->kind == LAMINA_GROUND_SUSPENDED);
  show_rows (self->basement_rows, G_N_ELEMENTS (self->basement_rows), g->kind == LAMINA_GROUND_BASEMENT);
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
  gtk_widget_set_visible (gtk_widget_get_prev_sibling (GTK_WIDGET (self->roof)), u->kind == LAMINA_UNHEATED_ROOF_SPACE);
  gtk_widget_set_visible (GTK_WIDGET (self->roof), u->kind == LAMINA_UNHEATED_ROOF_SPACE);
  set_number (self, NUM_INNER_AREA, u->inner_area);
  set_number (self, NUM_OUTER_AREA, u->outer_area);
  set_number (self, NUM_OUTER_U, u->outer_u);
  set_number (self, NUM_AIR_CHANGE, u->air_change);
  set_number (self, NUM_VOLUME, u->volume);
  show_rows (self->other_rows, G_N_ELEMENTS (self->other_rows), u->kind == LAMINA_UNHEATED_OTHER);
  s = &state->surfaces;
  set_number (self, NUM_WIND, s->wind_speed);
  set_number (self, NUM_EMISSIVITY_INSIDE, s->emissivity_inside);
  set_number (self, NUM_EMISSIVITY_OUTSIDE, s->emissivity_outside);
  gtk_check_button_set_active (self->air_profile, s->air_from_profile);
  self->updating = FALSE;
}

