/* SPDX-License-Identifier: GPL-3.0-or-later */
/* The editor's small dialogs: choose a material, make a layer bridged, an
 * air layer or a declared resistance, and attach corrections.  Each one
 * reads its fields, calls the pure edit function and applies the result;
 * a bad field is named in the error shown. */
#define G_LOG_DOMAIN "lamina-app"

#include "config.h"

#include <glib/gi18n.h>
#include <math.h>

#include "lamina-editor-form-private.h"
#include "lamina-editor-private.h"
#include "lamina-editor-state.h"
#include "lamina-number.h"
#include "lamina-text.h"

/* Every dialog here is a LaminaEditorForm: one grid holding the fields of
 * all of them (lamina-editor-form.ui), of which each dialog shows its own
 * rows, an error line and Cancel/Apply, with the dialog's own apply
 * function. */
typedef LaminaEditorForm Form;

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
  g_clear_object (&form->editor);

  G_OBJECT_CLASS (lamina_editor_form_parent_class)->dispose (object);
}

static void
lamina_editor_form_class_init (LaminaEditorFormClass *klass)
{
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  G_OBJECT_CLASS (klass)->dispose = lamina_editor_form_dispose;

  g_type_ensure (LAMINA_TYPE_MATERIAL_CHOOSER);
  gtk_widget_class_set_template_from_resource (widget_class, "/org/example/Lamina/lamina-editor-form.ui");
  gtk_widget_class_bind_template_child (widget_class, LaminaEditorForm, grid);
  gtk_widget_class_bind_template_child (widget_class, LaminaEditorForm, error_label);
  gtk_widget_class_bind_template_child (widget_class, LaminaEditorForm, material_label);
  gtk_widget_class_bind_template_child (widget_class, LaminaEditorForm, chooser);
  gtk_widget_class_bind_template_child (widget_class, LaminaEditorForm, thickness);
  gtk_widget_class_bind_template_child (widget_class, LaminaEditorForm, width);
  gtk_widget_class_bind_template_child (widget_class, LaminaEditorForm, spacing);
  gtk_widget_class_bind_template_child (widget_class, LaminaEditorForm, ventilation);
  gtk_widget_class_bind_template_child (widget_class, LaminaEditorForm, vent_area);
  gtk_widget_class_bind_template_child (widget_class, LaminaEditorForm, inner_emissivity);
  gtk_widget_class_bind_template_child (widget_class, LaminaEditorForm, outer_emissivity);
  gtk_widget_class_bind_template_child (widget_class, LaminaEditorForm, resistance);
  gtk_widget_class_bind_template_child (widget_class, LaminaEditorForm, air_gaps);
  gtk_widget_class_bind_template_child (widget_class, LaminaEditorForm, gap_level);
  gtk_widget_class_bind_template_child (widget_class, LaminaEditorForm, fasteners);
  gtk_widget_class_bind_template_child (widget_class, LaminaEditorForm, fastener_lambda);
  gtk_widget_class_bind_template_child (widget_class, LaminaEditorForm, fastener_area);
  gtk_widget_class_bind_template_child (widget_class, LaminaEditorForm, fastener_count);
  gtk_widget_class_bind_template_child (widget_class, LaminaEditorForm, inverted);
  gtk_widget_class_bind_template_child (widget_class, LaminaEditorForm, precipitation);
  gtk_widget_class_bind_template_child (widget_class, LaminaEditorForm, drainage);
  gtk_widget_class_bind_template_callback (widget_class, on_apply_clicked_cb);
  gtk_widget_class_bind_template_callback (widget_class, gtk_window_destroy);
}

static void
lamina_editor_form_init (LaminaEditorForm *form)
{
  gtk_widget_init_template (GTK_WIDGET (form));
  /* Each dialog shows its own rows (form_show). */
  for (GtkWidget *child = gtk_widget_get_first_child (GTK_WIDGET (form->grid));
       child != NULL;
       child = gtk_widget_get_next_sibling (child))
    gtk_widget_set_visible (child, FALSE);
}

static Form *
form_new (LaminaEditor          *editor,
          const char            *title,
          LaminaEditorFormApply  apply)
{
  GtkRoot *root = gtk_widget_get_root (GTK_WIDGET (editor));
  Form *form = g_object_new (LAMINA_TYPE_EDITOR_FORM, "title", title,
                             "transient-for", GTK_IS_WINDOW (root) ? GTK_WINDOW (root) : NULL,
                             NULL);

  form->editor = g_object_ref (editor);
  form->apply = apply;
  return form;
}

/* Shows @field and its label, the cell to its left. */
static void
form_show (Form      *form,
           GtkWidget *field)
{
  int column, row;

  gtk_grid_query_child (form->grid, field, &column, &row, NULL, NULL);
  gtk_widget_set_visible (gtk_grid_get_child_at (form->grid, column - 1, row), TRUE);
  gtk_widget_set_visible (field, TRUE);
}

static void
form_show_number (Form     *form,
                  GtkEntry *entry,
                  double    value,
                  int       decimals)
{
  g_autofree char *text = isnan (value) ? g_strdup ("") : lamina_text_number (value, decimals);

  gtk_editable_set_text (GTK_EDITABLE (entry), text);
  form_show (form, GTK_WIDGET (entry));
}

static void
form_show_check (Form           *form,
                 GtkCheckButton *check,
                 gboolean        active)
{
  gtk_check_button_set_active (check, active);
  form_show (form, GTK_WIDGET (check));
}

/* Parsed by the core's field parser: range and unit checked, the field
 * named in the message. */
static gboolean
form_get_number (GtkEntry           *entry,
                 LaminaNumberField   field,
                 gboolean            optional,
                 double             *value,
                 GError            **error)
{
  const char *text = gtk_editable_get_text (GTK_EDITABLE (entry));

  if (optional && lamina_text_is_blank (text))
    {
      *value = NAN;
      return TRUE;
    }
  if (lamina_number_parse (field, text, value, error))
    return TRUE;
  gtk_widget_add_css_class (GTK_WIDGET (entry), "error");
  return FALSE;
}

/* The library's materials in the chooser, the layer's own selected. */
static void
form_show_materials (Form           *form,
                     LaminaCategory  prefer,
                     const char     *current_id)
{
  LaminaLibrary *library = lamina_document_get_library (lamina_editor_get_document (form->editor));

  form_show (form, GTK_WIDGET (form->chooser));
  lamina_material_chooser_set_materials (form->chooser, lamina_library_list_materials (library, NULL),
                                         prefer, current_id);
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
  const LaminaMaterial *material = lamina_material_chooser_get_material (form->chooser);
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

      if (!form_get_number (form->thickness, LAMINA_FIELD_THICKNESS, FALSE, &thickness, error))
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
  form_show_materials (form, LAMINA_CATEGORY_INSULATION, current ? current->id : NULL);
  if (insert)
    form_show_number (form, form->thickness, 50, 0);
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

  if (!form_get_number (form->width, LAMINA_FIELD_WIDTH, FALSE, &width, error) ||
      !form_get_number (form->spacing, LAMINA_FIELD_SPACING, FALSE, &spacing, error))
    return FALSE;
  next = lamina_edit_make_bridged (form_state (form), form_layer (form), infill,
                                   lamina_material_chooser_get_material (form->chooser), width, spacing,
                                   _("framing"), error);
  return form_apply_next (form, next, NULL);
}

void
lamina_editor_edit_bridged (LaminaEditor *self)
{
  Form *form = form_new (self, _("Bridged Layer"), apply_bridged);

  gtk_label_set_text_with_mnemonic (form->material_label, _("_Framing member"));
  form_show_materials (form, LAMINA_CATEGORY_TIMBER, NULL);
  form_show_number (form, form->width, 45, 0);
  form_show_number (form, form->spacing, 600, 0);
  gtk_window_present (GTK_WINDOW (form));
}

/* Air layer */

static gboolean
apply_air (Form    *form,
           GError **error)
{
  double vent, e1, e2;
  LaminaConstruction *next;
  guint kind = gtk_drop_down_get_selected (form->ventilation);

  if (!form_get_number (form->vent_area, LAMINA_FIELD_VENT_AREA, TRUE, &vent, error) ||
      !form_get_number (form->inner_emissivity, LAMINA_FIELD_EMISSIVITY, FALSE, &e1, error) ||
      !form_get_number (form->outer_emissivity, LAMINA_FIELD_EMISSIVITY, FALSE, &e2, error))
    return FALSE;
  next = lamina_edit_make_air (form_state (form), form_layer (form), (LaminaAirKind) kind,
                               vent, e1, e2, error);
  return form_apply_next (form, next, NULL);
}

void
lamina_editor_edit_air (LaminaEditor *self)
{
  Form *form = form_new (self, _("Air Layer"), apply_air);

  form_show (form, GTK_WIDGET (form->ventilation));
  form_show_number (form, form->vent_area, NAN, 0);
  form_show_number (form, form->inner_emissivity, 0.9, 2);
  form_show_number (form, form->outer_emissivity, 0.9, 2);
  gtk_window_present (GTK_WINDOW (form));
}

/* Declared resistance */

static gboolean
apply_declared (Form    *form,
                GError **error)
{
  double r;
  LaminaConstruction *next;

  if (!form_get_number (form->resistance, LAMINA_FIELD_THERMAL_RESISTANCE, FALSE, &r, error))
    return FALSE;
  next = lamina_edit_make_declared (form_state (form), form_layer (form), r, error);
  return form_apply_next (form, next, NULL);
}

void
lamina_editor_edit_declared (LaminaEditor *self)
{
  Form *form = form_new (self, _("Declared Resistance"), apply_declared);

  form_show_number (form, form->resistance, 0.5, 2);
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
  c.has_air_gaps = gtk_check_button_get_active (form->air_gaps);
  c.has_fasteners = gtk_check_button_get_active (form->fasteners);
  c.has_inverted_roof = gtk_check_button_get_active (form->inverted);
  if (!form_get_number (form->gap_level, LAMINA_FIELD_AIR_GAP_LEVEL, FALSE, &level, error) ||
      !form_get_number (form->fastener_lambda, LAMINA_FIELD_CONDUCTIVITY, FALSE, &c.fastener_conductivity, error) ||
      !form_get_number (form->fastener_area, LAMINA_FIELD_FASTENER_AREA, FALSE, &c.fastener_cross_section, error) ||
      !form_get_number (form->fastener_count, LAMINA_FIELD_FASTENER_COUNT, FALSE, &c.fasteners_per_square_metre, error) ||
      !form_get_number (form->precipitation, LAMINA_FIELD_PRECIPITATION, FALSE, &c.precipitation, error) ||
      !form_get_number (form->drainage, LAMINA_FIELD_DRAINAGE_FACTOR, FALSE, &c.drainage_factor, error))
    return FALSE;
  c.air_gap_level = (int) level;
  next = lamina_edit_set_corrections (form_state (form), form_layer (form), &c, error);
  return form_apply_next (form, next, NULL);
}

void
lamina_editor_edit_corrections (LaminaEditor *self)
{
  Form *form = form_new (self, _("Corrections to U"), apply_corrections);
  const LaminaLayer *layer = form_current_layer (form);
  LaminaCorrections c = layer ? layer->corrections : (LaminaCorrections) { 0 };

  form_show_check (form, form->air_gaps, c.has_air_gaps);
  form_show_number (form, form->gap_level, c.air_gap_level, 0);
  form_show_check (form, form->fasteners, c.has_fasteners);
  form_show_number (form, form->fastener_lambda,
                    isnan (c.fastener_conductivity) || c.fastener_conductivity == 0 ? 50 : c.fastener_conductivity, 1);
  form_show_number (form, form->fastener_area, c.fastener_cross_section > 0 ? c.fastener_cross_section : 12.6, 1);
  form_show_number (form, form->fastener_count,
                    c.fasteners_per_square_metre > 0 ? c.fasteners_per_square_metre : 4, 1);
  form_show_check (form, form->inverted, c.has_inverted_roof);
  form_show_number (form, form->precipitation, c.precipitation > 0 ? c.precipitation : 2, 1);
  form_show_number (form, form->drainage, c.drainage_factor > 0 ? c.drainage_factor : 0.5, 2);
  gtk_window_present (GTK_WINDOW (form));
}
