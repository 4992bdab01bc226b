/* SPDX-License-Identifier: GPL-3.0-or-later */
/* The editor's small dialogs: choose a material, make a layer bridged, an
 * air layer or a declared resistance, and attach corrections.  Each one
 * reads its fields, calls the pure edit function and applies the result;
 * a bad field is named in the error shown. */
#define G_LOG_DOMAIN "lamina-app"

#include "config.h"

#include <glib/gi18n.h>
#include <math.h>

#include "lamina-editor-private.h"
#include "lamina-editor-state.h"
#include "lamina-number.h"
#include "lamina-text.h"

/* Every dialog here is a LaminaEditorForm: a grid of labelled fields, an
 * error line and Cancel/Apply, with the dialog's own apply function. */
#define LAMINA_TYPE_EDITOR_FORM (lamina_editor_form_get_type ())
G_DECLARE_FINAL_TYPE (LaminaEditorForm, lamina_editor_form, LAMINA, EDITOR_FORM, GtkWindow)

typedef LaminaEditorForm Form;
typedef gboolean (*FormApply) (Form *form, GError **error);

struct _LaminaEditorForm
{
  GtkWindow     parent_instance;

  /* template */
  GtkGrid      *grid;
  GtkLabel     *error_label;

  /* owned */
  LaminaEditor *editor;
  GHashTable   *fields;    /* field name → widget (borrowed from the grid) */
  FormApply     apply;
  GPtrArray    *materials; /* LaminaMaterial*, for the material chooser */
  GListModel   *material_names;      /* one string per material, in order */
  GtkSingleSelection *material_selection; /* over the search's filter */
  gboolean      insert;
  int           rows;
};

G_DEFINE_FINAL_TYPE (LaminaEditorForm, lamina_editor_form, GTK_TYPE_WINDOW)

static const LaminaConstruction *
form_state (Form *form)
{
  return lamina_document_get_construction (lamina_editor_get_document (form->editor));
}

static guint
form_layer (Form *form)
{
  int selected = lamina_editor_get_selected_layer (form->editor);

  return selected < 0 ? 0 : (guint) selected;
}

static const LaminaLayer *
form_current_layer (Form *form)
{
  const LaminaConstruction *state = form_state (form);
  guint index = form_layer (form);

  return index < state->layers->len ? g_ptr_array_index (state->layers, index) : NULL;
}

static void
on_apply_clicked_cb (Form *form)
{
  g_autoptr(GError) error = NULL;

  if (!form->apply (form, &error))
    {
      gtk_label_set_text (form->error_label, error ? error->message : _("Cannot apply"));
      gtk_widget_set_visible (GTK_WIDGET (form->error_label), TRUE);
      return;
    }
  gtk_window_destroy (GTK_WINDOW (form));
}

static void
lamina_editor_form_dispose (GObject *object)
{
  Form *form = LAMINA_EDITOR_FORM (object);

  gtk_widget_dispose_template (GTK_WIDGET (form), LAMINA_TYPE_EDITOR_FORM);
  g_clear_pointer (&form->fields, g_hash_table_unref);
  g_clear_pointer (&form->materials, g_ptr_array_unref);
  g_clear_object (&form->material_names);
  g_clear_object (&form->material_selection);
  g_clear_object (&form->editor);

  G_OBJECT_CLASS (lamina_editor_form_parent_class)->dispose (object);
}

static void
lamina_editor_form_class_init (LaminaEditorFormClass *klass)
{
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  G_OBJECT_CLASS (klass)->dispose = lamina_editor_form_dispose;

  gtk_widget_class_set_template_from_resource (widget_class, "/org/example/Lamina/lamina-editor-form.ui");
  gtk_widget_class_bind_template_child (widget_class, LaminaEditorForm, grid);
  gtk_widget_class_bind_template_child (widget_class, LaminaEditorForm, error_label);
  gtk_widget_class_bind_template_callback (widget_class, on_apply_clicked_cb);
  gtk_widget_class_bind_template_callback (widget_class, gtk_window_destroy);
}

static void
lamina_editor_form_init (LaminaEditorForm *form)
{
  gtk_widget_init_template (GTK_WIDGET (form));
  form->fields = g_hash_table_new (g_str_hash, g_str_equal);
}

static Form *
form_new (LaminaEditor *editor,
          const char   *title,
          FormApply     apply)
{
  GtkRoot *root = gtk_widget_get_root (GTK_WIDGET (editor));
  Form *form = g_object_new (LAMINA_TYPE_EDITOR_FORM, "title", title,
                             "transient-for", GTK_IS_WINDOW (root) ? GTK_WINDOW (root) : NULL,
                             NULL);

  form->editor = g_object_ref (editor);
  form->apply = apply;
  return form;
}

static void
form_add (Form       *form,
          const char *name,
          const char *label,
          GtkWidget  *widget)
{
  GtkWidget *title = gtk_label_new_with_mnemonic (label);

  gtk_label_set_xalign (GTK_LABEL (title), 0);
  gtk_label_set_mnemonic_widget (GTK_LABEL (title), widget);
  gtk_widget_set_hexpand (widget, TRUE);
  gtk_grid_attach (form->grid, title, 0, form->rows, 1, 1);
  gtk_grid_attach (form->grid, widget, 1, form->rows, 1, 1);
  gtk_accessible_update_relation (GTK_ACCESSIBLE (widget),
                                  GTK_ACCESSIBLE_RELATION_LABELLED_BY, title, NULL, -1);
  g_hash_table_insert (form->fields, (gpointer) name, widget);
  form->rows++;
}

static void
form_add_number (Form       *form,
                 const char *name,
                 const char *label,
                 double      value,
                 int         decimals)
{
  GtkWidget *entry = gtk_entry_new ();
  g_autofree char *text = isnan (value) ? g_strdup ("") : lamina_text_number (value, decimals);

  gtk_editable_set_text (GTK_EDITABLE (entry), text);
  gtk_entry_set_activates_default (GTK_ENTRY (entry), TRUE);
  gtk_entry_set_input_purpose (GTK_ENTRY (entry), GTK_INPUT_PURPOSE_NUMBER);
  form_add (form, name, label, entry);
}

/* Parsed by the core's field parser: range and unit checked, the field
 * named in the message. */
static gboolean
form_get_number (Form               *form,
                 const char         *name,
                 LaminaNumberField   field,
                 gboolean            optional,
                 double             *value,
                 GError            **error)
{
  GtkWidget *entry = g_hash_table_lookup (form->fields, name);
  const char *text = gtk_editable_get_text (GTK_EDITABLE (entry));

  if (optional && lamina_text_is_blank (text))
    {
      *value = NAN;
      return TRUE;
    }
  if (lamina_number_parse (field, text, value, error))
    return TRUE;
  gtk_widget_add_css_class (entry, "error");
  return FALSE;
}

static void
setup_material_row_cb (GtkSignalListItemFactory *factory,
                       GtkListItem              *item)
{
  GtkWidget *label = gtk_label_new (NULL);

  gtk_label_set_xalign (GTK_LABEL (label), 0);
  gtk_label_set_ellipsize (GTK_LABEL (label), PANGO_ELLIPSIZE_END);
  gtk_list_item_set_child (item, label);
}

static void
bind_material_row_cb (GtkSignalListItemFactory *factory,
                      GtkListItem              *item)
{
  GtkStringObject *text = gtk_list_item_get_item (item);
  GtkWidget *label = gtk_list_item_get_child (item);

  gtk_label_set_text (GTK_LABEL (label), gtk_string_object_get_string (text));
  gtk_widget_set_tooltip_text (label, gtk_string_object_get_string (text));
}

static void
on_material_search_changed_cb (GtkSearchEntry  *entry,
                               GtkStringFilter *filter)
{
  gtk_string_filter_set_search (filter, gtk_editable_get_text (GTK_EDITABLE (entry)));
}

/* A list that filters as one types, by any part of a word ("fibre" finds
 * "Wood-fibre"), at a fixed height so that the form and its buttons keep
 * still while it filters; the layer's own material comes selected. */
static GtkWidget *
form_add_materials (Form           *form,
                    const char     *name,
                    const char     *label,
                    LaminaCategory  prefer,
                    const char     *current_id)
{
  LaminaLibrary *library = lamina_document_get_library (lamina_editor_get_document (form->editor));
  GtkStringList *names = gtk_string_list_new (NULL);
  GtkStringFilter *filter;
  GtkFilterListModel *filtered;
  GtkSingleSelection *selection;
  GtkListItemFactory *factory = gtk_signal_list_item_factory_new ();
  GtkWidget *box = gtk_box_new (GTK_ORIENTATION_VERTICAL, 6);
  GtkWidget *search = gtk_search_entry_new ();
  GtkWidget *scroller = gtk_scrolled_window_new ();
  GtkWidget *list;
  guint preferred = GTK_INVALID_LIST_POSITION, current = GTK_INVALID_LIST_POSITION;

  form->materials = lamina_library_list_materials (library, NULL);
  if (form->materials == NULL)
    form->materials = g_ptr_array_new ();
  for (guint i = 0; i < form->materials->len; i++)
    {
      const LaminaMaterial *material = g_ptr_array_index (form->materials, i);
      g_autofree char *lambda = lamina_text_number (material->conductivity, 3);
      g_autofree char *text = g_strdup_printf ("%s (λ %s)", material->name, lambda);

      gtk_string_list_append (names, text);
      if (material->category == prefer && preferred == GTK_INVALID_LIST_POSITION)
        preferred = i;
      if (current_id != NULL && g_strcmp0 (material->id, current_id) == 0)
        current = i;
    }
  filter = gtk_string_filter_new (gtk_property_expression_new (GTK_TYPE_STRING_OBJECT, NULL, "string"));
  gtk_string_filter_set_match_mode (filter, GTK_STRING_FILTER_MATCH_MODE_SUBSTRING);
  gtk_string_filter_set_ignore_case (filter, TRUE);
  filtered = gtk_filter_list_model_new (G_LIST_MODEL (names), GTK_FILTER (filter));
  selection = gtk_single_selection_new (G_LIST_MODEL (filtered));
  g_signal_connect (factory, "setup", G_CALLBACK (setup_material_row_cb), NULL);
  g_signal_connect (factory, "bind", G_CALLBACK (bind_material_row_cb), NULL);
  list = gtk_list_view_new (GTK_SELECTION_MODEL (selection), factory);
  gtk_single_selection_set_selected (selection, current != GTK_INVALID_LIST_POSITION ? current
                                                : preferred != GTK_INVALID_LIST_POSITION ? preferred : 0);

  g_object_set (search, "placeholder-text", _("Search by any part of the name"), NULL);
  g_signal_connect_object (search, "search-changed", G_CALLBACK (on_material_search_changed_cb), filter, 0);
  g_signal_connect_swapped (search, "activate", G_CALLBACK (on_apply_clicked_cb), form);
  g_signal_connect_swapped (list, "activate", G_CALLBACK (on_apply_clicked_cb), form);
  gtk_scrolled_window_set_child (GTK_SCROLLED_WINDOW (scroller), list);
  gtk_scrolled_window_set_policy (GTK_SCROLLED_WINDOW (scroller), GTK_POLICY_NEVER, GTK_POLICY_AUTOMATIC);
  gtk_widget_set_size_request (scroller, 380, 240);
  gtk_widget_add_css_class (scroller, "frame");
  gtk_box_append (GTK_BOX (box), search);
  gtk_box_append (GTK_BOX (box), scroller);
  g_set_object (&form->material_names, G_LIST_MODEL (names));
  g_set_object (&form->material_selection, selection);
  gtk_accessible_update_property (GTK_ACCESSIBLE (list), GTK_ACCESSIBLE_PROPERTY_LABEL, _("Materials"), -1);
  form_add (form, name, label, box);
  /* The selected material in view once the list has its size. */
  if (gtk_single_selection_get_selected (selection) != GTK_INVALID_LIST_POSITION)
    gtk_widget_activate_action (list, "list.scroll-to-item", "u", gtk_single_selection_get_selected (selection));
  gtk_widget_grab_focus (search);
  return box;
}

/* The material picked in the chooser (the filter shows a subset of the
 * names, so the picked item is found among all of them). */
static const LaminaMaterial *
form_get_material (Form *form)
{
  GObject *picked;

  if (form->material_selection == NULL || form->materials == NULL)
    return NULL;
  picked = gtk_single_selection_get_selected_item (form->material_selection);
  for (guint i = 0; picked != NULL && i < form->materials->len; i++)
    {
      g_autoptr(GObject) item = g_list_model_get_item (form->material_names, i);

      if (item == picked)
        return g_ptr_array_index (form->materials, i);
    }
  return NULL;
}

static gboolean
form_apply_next (Form               *form,
                 LaminaConstruction *next,
                 GError             *error)
{
  if (next == NULL)
    return FALSE;
  lamina_editor_apply (form->editor, next, NULL, NULL);
  return TRUE;
}

/* Material */

static gboolean
apply_material (Form    *form,
                GError **error)
{
  const LaminaMaterial *material = form_get_material (form);
  const LaminaConstruction *state = form_state (form);
  LaminaConstruction *next;
  double thickness;

  if (material == NULL)
    {
      g_set_error_literal (error, G_IO_ERROR, G_IO_ERROR_INVALID_DATA, _("Material: choose one"));
      return FALSE;
    }
  if (form->insert)
    {
      g_autoptr(LaminaLayer) layer = NULL;
      guint at = state->layers->len ? form_layer (form) + 1 : 0;

      if (!form_get_number (form, "thickness", LAMINA_FIELD_THICKNESS, FALSE, &thickness, error))
        return FALSE;
      layer = lamina_layer_new_material (thickness, lamina_material_copy (material));
      next = lamina_edit_insert_layer (state, at, layer, error);
      if (!form_apply_next (form, next, NULL))
        return FALSE;
      lamina_section_view_set_selected (lamina_editor_get_section_view (form->editor), (int) at);
      return TRUE;
    }
  next = lamina_edit_set_material (state, form_layer (form), material, error);
  return form_apply_next (form, next, NULL);
}

void
lamina_editor_choose_material (LaminaEditor *self,
                               gboolean      insert)
{
  Form *form = form_new (self, insert ? _("Add Layer") : _("Layer Material"), apply_material);

  const LaminaLayer *layer = insert ? NULL : form_current_layer (form);
  const LaminaMaterial *current = layer && layer->kind == LAMINA_LAYER_MATERIAL ? layer->material : NULL;

  form->insert = insert;
  form_add_materials (form, "material", _("_Material"), LAMINA_CATEGORY_INSULATION, current ? current->id : NULL);
  if (insert)
    form_add_number (form, "thickness", _("_Thickness (mm)"), 50, 0);
  gtk_window_present (GTK_WINDOW (form));
}

/* Bridged */

static gboolean
apply_bridged (Form    *form,
               GError **error)
{
  double width, spacing;
  LaminaConstruction *next;
  const LaminaLayer *layer = form_current_layer (form);
  const LaminaMaterial *infill = layer && layer->kind == LAMINA_LAYER_MATERIAL ? layer->material : NULL;

  if (!form_get_number (form, "width", LAMINA_FIELD_WIDTH, FALSE, &width, error) ||
      !form_get_number (form, "spacing", LAMINA_FIELD_SPACING, FALSE, &spacing, error))
    return FALSE;
  next = lamina_edit_make_bridged (form_state (form), form_layer (form), infill,
                                   form_get_material (form), width, spacing,
                                   _("framing"), error);
  return form_apply_next (form, next, NULL);
}

void
lamina_editor_edit_bridged (LaminaEditor *self)
{
  Form *form = form_new (self, _("Bridged Layer"), apply_bridged);

  form_add_materials (form, "framing", _("_Framing member"), LAMINA_CATEGORY_TIMBER, NULL);
  form_add_number (form, "width", _("_Width (mm)"), 45, 0);
  form_add_number (form, "spacing", _("_Spacing, centres (mm)"), 600, 0);
  gtk_window_present (GTK_WINDOW (form));
}

/* Air layer */

static gboolean
apply_air (Form    *form,
           GError **error)
{
  double vent, e1, e2;
  LaminaConstruction *next;
  guint kind = gtk_drop_down_get_selected (g_hash_table_lookup (form->fields, "kind"));

  if (!form_get_number (form, "vent", LAMINA_FIELD_VENT_AREA, TRUE, &vent, error) ||
      !form_get_number (form, "e1", LAMINA_FIELD_EMISSIVITY, FALSE, &e1, error) ||
      !form_get_number (form, "e2", LAMINA_FIELD_EMISSIVITY, FALSE, &e2, error))
    return FALSE;
  next = lamina_edit_make_air (form_state (form), form_layer (form), (LaminaAirKind) kind,
                               vent, e1, e2, error);
  return form_apply_next (form, next, NULL);
}

void
lamina_editor_edit_air (LaminaEditor *self)
{
  Form *form = form_new (self, _("Air Layer"), apply_air);
  const char *kinds[] = { N_("Unventilated"), N_("Slightly ventilated"), N_("Well ventilated"), NULL };
  g_autoptr(GtkStringList) names = gtk_string_list_new (NULL);
  GtkWidget *dropdown;

  for (guint i = 0; kinds[i]; i++)
    gtk_string_list_append (names, _(kinds[i]));
  dropdown = gtk_drop_down_new (G_LIST_MODEL (g_steal_pointer (&names)), NULL);
  form_add (form, "kind", _("_Ventilation"), dropdown);
  form_add_number (form, "vent", _("Vent _area (mm² per m)"), NAN, 0);
  form_add_number (form, "e1", _("_Inner face ε"), 0.9, 2);
  form_add_number (form, "e2", _("_Outer face ε"), 0.9, 2);
  gtk_window_present (GTK_WINDOW (form));
}

/* Declared resistance */

static gboolean
apply_declared (Form    *form,
                GError **error)
{
  double r;
  LaminaConstruction *next;

  if (!form_get_number (form, "r", LAMINA_FIELD_THERMAL_RESISTANCE, FALSE, &r, error))
    return FALSE;
  next = lamina_edit_make_declared (form_state (form), form_layer (form), r, error);
  return form_apply_next (form, next, NULL);
}

void
lamina_editor_edit_declared (LaminaEditor *self)
{
  Form *form = form_new (self, _("Declared Resistance"), apply_declared);

  form_add_number (form, "r", _("_Thermal resistance R (m²·K/W)"), 0.5, 2);
  gtk_window_present (GTK_WINDOW (form));
}

/* Corrections */

static gboolean
apply_corrections (Form    *form,
                   GError **error)
{
  const LaminaLayer *layer = form_current_layer (form);
  LaminaCorrections c;
  LaminaConstruction *next;
  double level;

  if (layer == NULL)
    return FALSE;
  c = layer->corrections;
  c.has_air_gaps = gtk_check_button_get_active (g_hash_table_lookup (form->fields, "gaps"));
  c.has_fasteners = gtk_check_button_get_active (g_hash_table_lookup (form->fields, "fasteners"));
  c.has_inverted_roof = gtk_check_button_get_active (g_hash_table_lookup (form->fields, "inverted"));
  if (!form_get_number (form, "level", LAMINA_FIELD_AIR_GAP_LEVEL, FALSE, &level, error) ||
      !form_get_number (form, "lf", LAMINA_FIELD_CONDUCTIVITY, FALSE, &c.fastener_conductivity, error) ||
      !form_get_number (form, "af", LAMINA_FIELD_FASTENER_AREA, FALSE, &c.fastener_cross_section, error) ||
      !form_get_number (form, "nf", LAMINA_FIELD_FASTENER_COUNT, FALSE, &c.fasteners_per_square_metre, error) ||
      !form_get_number (form, "p", LAMINA_FIELD_PRECIPITATION, FALSE, &c.precipitation, error) ||
      !form_get_number (form, "f", LAMINA_FIELD_DRAINAGE_FACTOR, FALSE, &c.drainage_factor, error))
    return FALSE;
  c.air_gap_level = (int) level;
  next = lamina_edit_set_corrections (form_state (form), form_layer (form), &c, error);
  return form_apply_next (form, next, NULL);
}

static GtkWidget *
new_check (const char *label,
           gboolean    active)
{
  GtkWidget *check = gtk_check_button_new ();

  gtk_check_button_set_active (GTK_CHECK_BUTTON (check), active);
  gtk_accessible_update_property (GTK_ACCESSIBLE (check), GTK_ACCESSIBLE_PROPERTY_LABEL, label, -1);
  return check;
}

void
lamina_editor_edit_corrections (LaminaEditor *self)
{
  Form *form = form_new (self, _("Corrections to U"), apply_corrections);
  const LaminaLayer *layer = form_current_layer (form);
  LaminaCorrections c = layer ? layer->corrections : (LaminaCorrections) { 0 };

  form_add (form, "gaps", _("Air _gaps in this layer"), new_check (_("Air gaps"), c.has_air_gaps));
  form_add_number (form, "level", _("Air gap _level (0–2)"), c.air_gap_level, 0);
  form_add (form, "fasteners", _("_Fasteners through it"), new_check (_("Fasteners"), c.has_fasteners));
  form_add_number (form, "lf", _("Fastener λ (W/(m·K))"), isnan (c.fastener_conductivity) || c.fastener_conductivity == 0 ? 50 : c.fastener_conductivity, 1);
  form_add_number (form, "af", _("Cross-section (mm²)"), c.fastener_cross_section > 0 ? c.fastener_cross_section : 12.6, 1);
  form_add_number (form, "nf", _("Fasteners per m²"), c.fasteners_per_square_metre > 0 ? c.fasteners_per_square_metre : 4, 1);
  form_add (form, "inverted", _("_Inverted roof"), new_check (_("Inverted roof"), c.has_inverted_roof));
  form_add_number (form, "p", _("Precipitation (mm/day)"), c.precipitation > 0 ? c.precipitation : 2, 1);
  form_add_number (form, "f", _("Drainage factor f"), c.drainage_factor > 0 ? c.drainage_factor : 0.5, 2);
  gtk_window_present (GTK_WINDOW (form));
}
