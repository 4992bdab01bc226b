/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "lamina-app"

#include "config.h"

#include "lamina-editor-private.h"

#include <glib/gi18n.h>
#include <math.h>

#include "lamina-editor-state.h"
#include "lamina-text.h"
#include "lamina-layer-row.h"
#include "lamina-library-safety.h"
#include "lamina-parts-dialog.h"
#include "lamina-properties-view.h"
#include "lamina-solve.h"
#include "lamina-target-dialog.h"
#include "lamina-method-view.h"

struct _LaminaEditor
{
  GtkWidget          parent_instance;

  /* template */
  GtkWidget         *box;
  GtkEntry          *code_entry;
  GtkEntry          *name_entry;
  GtkLabel          *element_label;
  GtkLabel          *status_label;
  GtkLabel          *revision_label;
  GtkWidget         *material_flag;
  LaminaSectionView *section_view;
  GtkListBox        *layer_list;
  LaminaResultsView *results_view;
  LaminaMoistureView *moisture_view;
  GtkStack          *results_stack;
  LaminaPropertiesView *properties_view;
  LaminaMethodView     *method_view;
  GtkStack          *page_stack;

  /* owned */
  LaminaDocument    *document;
  gulong             changed_id;
  guint              drag_serial;
  int                flag_revision;
  double             snap_step;
  gboolean           updating;
};

G_DEFINE_FINAL_TYPE (LaminaEditor, lamina_editor, GTK_TYPE_WIDGET)

enum {
  PROP_0,
  PROP_SHOW_TEMPERATURES,
  N_PROPS
};

static GParamSpec *properties[N_PROPS];

static const LaminaConstruction *
get_state (LaminaEditor *self)
{
  return self->document ? lamina_document_get_construction (self->document) : NULL;
}

int
lamina_editor_get_selected_layer (LaminaEditor *self)
{
  g_return_val_if_fail (LAMINA_IS_EDITOR (self), -1);
  return lamina_section_view_get_selected (self->section_view);
}

void
lamina_editor_apply (LaminaEditor       *self,
                     LaminaConstruction *next,
                     const char         *group,
                     GError             *error)
{
  g_return_if_fail (LAMINA_IS_EDITOR (self));

  if (next == NULL)
    {
      GtkRoot *root = gtk_widget_get_root (GTK_WIDGET (self));

      if (error != NULL)
        g_signal_emit_by_name (self->document, "notice", error->message);
      (void) root;
      return;
    }
  lamina_document_apply (self->document, next, group, LAMINA_APPLY_DEFAULT);
}

static void
set_entry_text (GtkEntry   *entry,
                const char *text)
{
  /* Leave what the user is typing alone. */
  if (gtk_widget_has_focus (GTK_WIDGET (entry)) || gtk_widget_is_focus (GTK_WIDGET (entry)))
    return;
  if (g_strcmp0 (gtk_editable_get_text (GTK_EDITABLE (entry)), text ? text : "") != 0)
    gtk_editable_set_text (GTK_EDITABLE (entry), text ? text : "");
}

static void
update_header (LaminaEditor             *self,
               const LaminaConstruction *state)
{
  static const char *status_classes[] = { "draft", "checked", "approved" };
  g_autofree char *revision = NULL;

  set_entry_text (self->code_entry, state->code);
  set_entry_text (self->name_entry, state->name);
  gtk_label_set_text (self->element_label, lamina_text_element_name (state->element));
  gtk_label_set_text (self->status_label, lamina_text_status_name (state->status));
  for (guint i = 0; i < G_N_ELEMENTS (status_classes); i++)
    gtk_widget_remove_css_class (GTK_WIDGET (self->status_label), status_classes[i]);
  gtk_widget_add_css_class (GTK_WIDGET (self->status_label), status_classes[state->status % 3]);
  revision = g_strdup_printf (_("Revision %d"), state->revision);
  gtk_label_set_text (self->revision_label, revision);
}

static void
on_row_thickness_changed_cb (LaminaEditor *self,
                             guint         index,
                             double        thickness)
{
  if (self->updating)
    return;
  lamina_editor_resize_layer (self, index, thickness, FALSE);
}

static GdkContentProvider *
on_row_drag_prepare_cb (GtkDragSource *source,
                        double         x,
                        double         y,
                        LaminaEditor  *self)
{
  GtkWidget *row = gtk_event_controller_get_widget (GTK_EVENT_CONTROLLER (source));

  return gdk_content_provider_new_typed (G_TYPE_UINT, (guint) gtk_list_box_row_get_index (GTK_LIST_BOX_ROW (row)));
}

static gboolean
on_row_drop_cb (GtkDropTarget *target,
                const GValue  *value,
                double         x,
                double         y,
                LaminaEditor  *self)
{
  GtkWidget *row = gtk_event_controller_get_widget (GTK_EVENT_CONTROLLER (target));
  g_autoptr(GError) error = NULL;
  guint from = g_value_get_uint (value);
  guint to = (guint) gtk_list_box_row_get_index (GTK_LIST_BOX_ROW (row));
  LaminaConstruction *next;

  if (from == to || get_state (self) == NULL)
    return FALSE;
  next = lamina_edit_move_layer (get_state (self), from, to, &error);
  lamina_section_view_set_selected (self->section_view, (int) to);
  lamina_editor_apply (self, next, NULL, error);
  return next != NULL;
}

/* Layers reorder by drag and drop of their rows (and Alt+Up/Down). */
static void
add_row_dnd (LaminaEditor *self,
             GtkWidget    *row)
{
  GtkDragSource *source = gtk_drag_source_new ();
  GtkDropTarget *target = gtk_drop_target_new (G_TYPE_UINT, GDK_ACTION_MOVE);

  gtk_drag_source_set_actions (source, GDK_ACTION_MOVE);
  g_signal_connect_object (source, "prepare", G_CALLBACK (on_row_drag_prepare_cb), self, 0);
  gtk_widget_add_controller (row, GTK_EVENT_CONTROLLER (source));
  g_signal_connect_object (target, "drop", G_CALLBACK (on_row_drop_cb), self, 0);
  gtk_widget_add_controller (row, GTK_EVENT_CONTROLLER (target));
}

static void
update_rows (LaminaEditor             *self,
             const LaminaConstruction *state,
             const LaminaResult       *result)
{
  GtkWidget *child;
  guint n_rows = 0;
  guint i = 0;
  int selected = lamina_section_view_get_selected (self->section_view);

  for (child = gtk_widget_get_first_child (GTK_WIDGET (self->layer_list)); child;
       child = gtk_widget_get_next_sibling (child))
    n_rows++;
  while (n_rows > state->layers->len)
    {
      gtk_list_box_remove (self->layer_list, gtk_widget_get_last_child (GTK_WIDGET (self->layer_list)));
      n_rows--;
    }
  for (; n_rows < state->layers->len; n_rows++)
    {
      GtkWidget *row = lamina_layer_row_new ();

      g_signal_connect_object (row, "thickness-changed",
                               G_CALLBACK (on_row_thickness_changed_cb), self, G_CONNECT_SWAPPED);
      add_row_dnd (self, row);
      gtk_list_box_append (self->layer_list, row);
    }

  for (child = gtk_widget_get_first_child (GTK_WIDGET (self->layer_list)); child;
       child = gtk_widget_get_next_sibling (child), i++)
    lamina_layer_row_update (LAMINA_LAYER_ROW (child), i, g_ptr_array_index (state->layers, i),
                             result && i < result->n_layers ? &result->layers[i] : NULL,
                             result ? result->r_total : NAN, self->snap_step);

  if (selected >= 0)
    gtk_list_box_select_row (self->layer_list, gtk_list_box_get_row_at_index (self->layer_list, selected));
}

static void
update_actions (LaminaEditor *self)
{
  const LaminaConstruction *state = get_state (self);
  int selected = lamina_section_view_get_selected (self->section_view);
  /* A read-only library is for browsing: no edit is offered, so none is
   * refused after the fact. */
  gboolean writable = self->document != NULL
                      && !lamina_library_is_read_only (lamina_document_get_library (self->document));
  gboolean has_layer = writable && state != NULL && selected >= 0 && (guint) selected < state->layers->len;

  gtk_editable_set_editable (GTK_EDITABLE (self->code_entry), writable);
  gtk_editable_set_editable (GTK_EDITABLE (self->name_entry), writable);
  for (GtkWidget *row = gtk_widget_get_first_child (GTK_WIDGET (self->layer_list)); row != NULL;
       row = gtk_widget_get_next_sibling (row))
    if (LAMINA_IS_LAYER_ROW (row))
      lamina_layer_row_set_writable (LAMINA_LAYER_ROW (row), writable);
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "editor.add-layer", writable && state != NULL);
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "editor.remove-layer",
                                 has_layer && state->layers->len > 1);
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "editor.duplicate-layer", has_layer);
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "editor.move-layer",
                                 has_layer && state->layers->len > 1);
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "editor.choose-material", has_layer);
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "editor.make-bridged", has_layer);
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "editor.edit-parts",
                                 has_layer && ((LaminaLayer *) state->layers->pdata[selected])->kind == LAMINA_LAYER_BRIDGED);
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "editor.make-air", has_layer);
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "editor.make-declared", has_layer);
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "editor.corrections", has_layer);
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "editor.meet-target",
                                 has_layer && lamina_solve_check_layer (state, selected + 1, NULL));
}

/* "Material data changed since review": asked of the store once per saved
 * revision, not per frame of a drag. */
static void
update_material_flag (LaminaEditor *self)
{
  g_autoptr(GPtrArray) changes = NULL;
  int revision = lamina_document_get_base_revision (self->document);

  if (revision == self->flag_revision)
    return;
  self->flag_revision = revision;
  changes = lamina_library_list_material_changes (lamina_document_get_library (self->document),
                                                  lamina_document_get_id (self->document), NULL);
  gtk_widget_set_visible (self->material_flag, changes != NULL && changes->len > 0);
}

static void
refresh (LaminaEditor *self)
{
  const LaminaConstruction *state = get_state (self);
  const LaminaResult *result;

  if (state == NULL)
    return;
  result = lamina_document_get_result (self->document);
  self->updating = TRUE;
  update_header (self, state);
  lamina_section_view_set_construction (self->section_view, state, result);
  update_rows (self, state, result);
  lamina_results_view_update (self->results_view, state, result,
                              lamina_document_get_calc_error (self->document));
  lamina_properties_view_update (self->properties_view, state, result);
  lamina_method_view_update (self->method_view, state, result);
  lamina_moisture_view_set_limit (self->moisture_view,
                                  lamina_library_get_moisture_limit (lamina_document_get_library (self->document)));
  lamina_moisture_view_update (self->moisture_view, state);
  self->updating = FALSE;
  update_material_flag (self);
  update_actions (self);
}

static void
on_document_changed_cb (LaminaEditor *self)
{
  refresh (self);
}

void
lamina_editor_resize_layer (LaminaEditor *self,
                            guint         index,
                            double        thickness,
                            gboolean      live)
{
  g_autoptr(GError) error = NULL;
  g_autofree char *group = NULL;
  LaminaConstruction *next;
  const LaminaConstruction *state;
  const LaminaLayer *layer;

  g_return_if_fail (LAMINA_IS_EDITOR (self));

  state = get_state (self);
  if (state == NULL || index >= state->layers->len)
    return;
  layer = g_ptr_array_index (state->layers, index);
  /* One undo step per drag; typing into a field makes one per value. */
  group = g_strdup_printf ("resize-%u-%u", index, self->drag_serial);
  if (layer->thickness != thickness)
    {
      next = lamina_edit_set_thickness (state, index, thickness, &error);
      if (next == NULL)
        {
          lamina_editor_apply (self, NULL, NULL, error);
          return;
        }
      lamina_document_apply (self->document, next, group, live ? LAMINA_APPLY_LIVE : LAMINA_APPLY_DEFAULT);
    }
  if (!live)
    {
      lamina_document_commit (self->document, NULL);
      self->drag_serial++;
    }
}

static void
on_section_resize_cb (LaminaEditor *self,
                      guint         index,
                      double        thickness,
                      gboolean      live)
{
  lamina_editor_resize_layer (self, index, thickness, live);
}

static void
on_section_selected_cb (LaminaEditor *self)
{
  int selected = lamina_section_view_get_selected (self->section_view);
  GtkListBoxRow *row = selected >= 0 ? gtk_list_box_get_row_at_index (self->layer_list, selected) : NULL;

  if (row != NULL && gtk_list_box_get_selected_row (self->layer_list) != row)
    gtk_list_box_select_row (self->layer_list, row);
  update_actions (self);
}

static gboolean
on_layer_list_key_pressed_cb (LaminaEditor          *self,
                              guint                  keyval,
                              guint                  keycode,
                              GdkModifierType        state,
                              GtkEventControllerKey *controller)
{
  if (gtk_list_box_get_selected_row (self->layer_list) == NULL)
    return FALSE;
  return lamina_section_view_resize_key (self->section_view, keyval, state);
}

static void
on_row_selected_cb (LaminaEditor  *self,
                    GtkListBoxRow *row)
{
  if (row != NULL && !self->updating)
    lamina_section_view_set_selected (self->section_view, gtk_list_box_row_get_index (row));
}

static void
on_conditions_changed_cb (LaminaEditor *self,
                          double        inside,
                          double        outside,
                          double        target)
{
  g_autoptr(GError) error = NULL;
  const LaminaConstruction *state = get_state (self);
  LaminaConstruction *next;

  if (state == NULL || self->updating)
    return;
  if (state->inside_temperature == inside && state->outside_temperature == outside &&
      ((isnan (target) && isnan (state->target_u)) || target == state->target_u))
    return;
  next = lamina_edit_set_conditions (state, inside, outside, target, &error);
  lamina_editor_apply (self, next, "conditions", error);
}

static void
commit_names (LaminaEditor *self)
{
  g_autoptr(GError) error = NULL;
  const LaminaConstruction *state = get_state (self);
  const char *code = gtk_editable_get_text (GTK_EDITABLE (self->code_entry));
  const char *name = gtk_editable_get_text (GTK_EDITABLE (self->name_entry));
  LaminaConstruction *next;

  if (state == NULL || self->updating)
    return;
  if (g_strcmp0 (code, state->code ? state->code : "") == 0 && g_strcmp0 (name, state->name) == 0)
    return;
  next = lamina_edit_set_names (state, code, name, NULL, &error);
  if (next == NULL)
    gtk_widget_add_css_class (GTK_WIDGET (self->name_entry), "error");
  else
    gtk_widget_remove_css_class (GTK_WIDGET (self->name_entry), "error");
  lamina_editor_apply (self, next, NULL, error);
}

static void
on_name_activate_cb (LaminaEditor *self)
{
  commit_names (self);
}

static void
on_name_focus_leave_cb (LaminaEditor *self)
{
  commit_names (self);
}

static guint
get_selected_index (LaminaEditor *self)
{
  int selected = lamina_section_view_get_selected (self->section_view);

  return selected < 0 ? 0 : (guint) selected;
}

static void
add_layer_action (GtkWidget  *widget,
                  const char *action_name,
                  GVariant   *parameter)
{
  lamina_editor_choose_material (LAMINA_EDITOR (widget), TRUE);
}

static void
remove_layer_action (GtkWidget  *widget,
                     const char *action_name,
                     GVariant   *parameter)
{
  LaminaEditor *self = LAMINA_EDITOR (widget);
  g_autoptr(GError) error = NULL;
  LaminaConstruction *next = lamina_edit_remove_layer (get_state (self), get_selected_index (self), &error);

  lamina_editor_apply (self, next, NULL, error);
}

static void
duplicate_layer_action (GtkWidget  *widget,
                        const char *action_name,
                        GVariant   *parameter)
{
  LaminaEditor *self = LAMINA_EDITOR (widget);
  g_autoptr(GError) error = NULL;
  guint index = get_selected_index (self);
  LaminaConstruction *next = lamina_edit_duplicate_layer (get_state (self), index, &error);

  lamina_editor_apply (self, next, NULL, error);
  if (next != NULL)
    lamina_section_view_set_selected (self->section_view, (int) index + 1);
}

static void
move_layer_action (GtkWidget  *widget,
                   const char *action_name,
                   GVariant   *parameter)
{
  LaminaEditor *self = LAMINA_EDITOR (widget);
  const LaminaConstruction *state = get_state (self);
  g_autoptr(GError) error = NULL;
  guint index = get_selected_index (self);
  int to = (int) index + g_variant_get_int32 (parameter);
  LaminaConstruction *next;

  if (state == NULL || to < 0 || (guint) to >= state->layers->len)
    return;
  next = lamina_edit_move_layer (state, index, (guint) to, &error);
  lamina_section_view_set_selected (self->section_view, to);
  lamina_editor_apply (self, next, NULL, error);
}

static void
layer_kind_action (GtkWidget  *widget,
                   const char *action_name,
                   GVariant   *parameter)
{
  LaminaEditor *self = LAMINA_EDITOR (widget);

  if (g_str_equal (action_name, "editor.choose-material"))
    lamina_editor_choose_material (self, FALSE);
  else if (g_str_equal (action_name, "editor.make-bridged"))
    lamina_editor_edit_bridged (self);
  else if (g_str_equal (action_name, "editor.edit-parts"))
    {
      GtkRoot *root = gtk_widget_get_root (widget);

      lamina_parts_dialog_present (GTK_IS_WINDOW (root) ? GTK_WINDOW (root) : NULL,
                                   self->document, get_selected_index (self));
    }
  else if (g_str_equal (action_name, "editor.make-air"))
    lamina_editor_edit_air (self);
  else if (g_str_equal (action_name, "editor.make-declared"))
    lamina_editor_edit_declared (self);
  else
    lamina_editor_edit_corrections (self);
}

static void
meet_target_action (GtkWidget  *widget,
                    const char *action_name,
                    GVariant   *parameter)
{
  LaminaEditor *self = LAMINA_EDITOR (widget);
  int index = get_selected_index (self);

  GtkRoot *root = gtk_widget_get_root (widget);

  if (index >= 0 && self->document != NULL)
    gtk_window_present (GTK_WINDOW (lamina_target_dialog_new (GTK_IS_WINDOW (root) ? GTK_WINDOW (root) : NULL,
                                                              self->document, (guint) index)));
}

static void
zoom_action (GtkWidget  *widget,
             const char *action_name,
             GVariant   *parameter)
{
  LaminaEditor *self = LAMINA_EDITOR (widget);
  double zoom = lamina_section_view_get_zoom (self->section_view);

  if (g_str_equal (action_name, "editor.zoom-in"))
    zoom *= 1.25;
  else if (g_str_equal (action_name, "editor.zoom-out"))
    zoom /= 1.25;
  else
    zoom = 1.0;
  lamina_section_view_set_zoom (self->section_view, zoom);
}

static void
lamina_editor_dispose (GObject *object)
{
  LaminaEditor *self = LAMINA_EDITOR (object);

  if (self->document != NULL)
    g_clear_signal_handler (&self->changed_id, self->document);
  g_clear_object (&self->document);
  gtk_widget_dispose_template (GTK_WIDGET (self), LAMINA_TYPE_EDITOR);

  G_OBJECT_CLASS (lamina_editor_parent_class)->dispose (object);
}

static void
lamina_editor_get_property (GObject    *object,
                            guint       prop_id,
                            GValue     *value,
                            GParamSpec *pspec)
{
  LaminaEditor *self = LAMINA_EDITOR (object);

  if (prop_id == PROP_SHOW_TEMPERATURES)
    g_value_set_boolean (value, lamina_section_view_get_show_temperatures (self->section_view));
  else
    G_OBJECT_WARN_INVALID_PROPERTY_ID (object, prop_id, pspec);
}

static void
lamina_editor_set_property (GObject      *object,
                            guint         prop_id,
                            const GValue *value,
                            GParamSpec   *pspec)
{
  LaminaEditor *self = LAMINA_EDITOR (object);

  if (prop_id == PROP_SHOW_TEMPERATURES)
    lamina_section_view_set_show_temperatures (self->section_view, g_value_get_boolean (value));
  else
    G_OBJECT_WARN_INVALID_PROPERTY_ID (object, prop_id, pspec);
}

static void
lamina_editor_class_init (LaminaEditorClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->dispose = lamina_editor_dispose;
  object_class->get_property = lamina_editor_get_property;
  object_class->set_property = lamina_editor_set_property;

  properties[PROP_SHOW_TEMPERATURES] =
    g_param_spec_boolean ("show-temperatures", NULL, NULL, FALSE,
                          G_PARAM_READWRITE | G_PARAM_STATIC_STRINGS | G_PARAM_EXPLICIT_NOTIFY);
  g_object_class_install_properties (object_class, N_PROPS, properties);

  g_type_ensure (LAMINA_TYPE_SECTION_VIEW);
  g_type_ensure (LAMINA_TYPE_RESULTS_VIEW);
  g_type_ensure (LAMINA_TYPE_MOISTURE_VIEW);
  g_type_ensure (LAMINA_TYPE_PROPERTIES_VIEW);
  g_type_ensure (LAMINA_TYPE_METHOD_VIEW);
  gtk_widget_class_set_template_from_resource (widget_class, "/org/example/Lamina/lamina-editor.ui");
  gtk_widget_class_bind_template_child (widget_class, LaminaEditor, box);
  gtk_widget_class_bind_template_child (widget_class, LaminaEditor, code_entry);
  gtk_widget_class_bind_template_child (widget_class, LaminaEditor, name_entry);
  gtk_widget_class_bind_template_child (widget_class, LaminaEditor, element_label);
  gtk_widget_class_bind_template_child (widget_class, LaminaEditor, status_label);
  gtk_widget_class_bind_template_child (widget_class, LaminaEditor, revision_label);
  gtk_widget_class_bind_template_child (widget_class, LaminaEditor, material_flag);
  gtk_widget_class_bind_template_child (widget_class, LaminaEditor, section_view);
  gtk_widget_class_bind_template_child (widget_class, LaminaEditor, layer_list);
  gtk_widget_class_bind_template_child (widget_class, LaminaEditor, results_view);
  gtk_widget_class_bind_template_child (widget_class, LaminaEditor, moisture_view);
  gtk_widget_class_bind_template_child (widget_class, LaminaEditor, results_stack);
  gtk_widget_class_bind_template_child (widget_class, LaminaEditor, properties_view);
  gtk_widget_class_bind_template_child (widget_class, LaminaEditor, method_view);
  gtk_widget_class_bind_template_child (widget_class, LaminaEditor, page_stack);
  gtk_widget_class_set_layout_manager_type (widget_class, GTK_TYPE_BIN_LAYOUT);

  gtk_widget_class_install_action (widget_class, "editor.add-layer", NULL, add_layer_action);
  gtk_widget_class_install_action (widget_class, "editor.remove-layer", NULL, remove_layer_action);
  gtk_widget_class_install_action (widget_class, "editor.duplicate-layer", NULL, duplicate_layer_action);
  gtk_widget_class_install_action (widget_class, "editor.move-layer", "i", move_layer_action);
  gtk_widget_class_install_action (widget_class, "editor.choose-material", NULL, layer_kind_action);
  gtk_widget_class_install_action (widget_class, "editor.make-bridged", NULL, layer_kind_action);
  gtk_widget_class_install_action (widget_class, "editor.edit-parts", NULL, layer_kind_action);
  gtk_widget_class_install_action (widget_class, "editor.make-air", NULL, layer_kind_action);
  gtk_widget_class_install_action (widget_class, "editor.make-declared", NULL, layer_kind_action);
  gtk_widget_class_install_action (widget_class, "editor.corrections", NULL, layer_kind_action);
  gtk_widget_class_install_action (widget_class, "editor.meet-target", NULL, meet_target_action);
  gtk_widget_class_install_action (widget_class, "editor.zoom-in", NULL, zoom_action);
  gtk_widget_class_install_action (widget_class, "editor.zoom-out", NULL, zoom_action);
  gtk_widget_class_install_action (widget_class, "editor.zoom-fit", NULL, zoom_action);
  gtk_widget_class_install_property_action (widget_class, "editor.show-temperatures", "show-temperatures");

  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_0, GDK_CONTROL_MASK, "editor.zoom-fit", NULL);
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_plus, GDK_CONTROL_MASK, "editor.zoom-in", NULL);
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_minus, GDK_CONTROL_MASK, "editor.zoom-out", NULL);
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_Insert, 0, "editor.add-layer", NULL);
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_d, GDK_CONTROL_MASK, "editor.duplicate-layer", NULL);
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_Up, GDK_ALT_MASK, "editor.move-layer", "i", -1);
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_Down, GDK_ALT_MASK, "editor.move-layer", "i", 1);
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_t, GDK_CONTROL_MASK, "editor.show-temperatures", NULL);
}

static void
on_show_temperatures_cb (LaminaEditor *self)
{
  g_object_notify_by_pspec (G_OBJECT (self), properties[PROP_SHOW_TEMPERATURES]);
}

static void
lamina_editor_init (LaminaEditor *self)
{
  GtkEventController *focus;
  GtkEventController *key;

  gtk_widget_init_template (GTK_WIDGET (self));
  self->snap_step = 5.0;

  g_signal_connect_object (self->section_view, "resize",
                           G_CALLBACK (on_section_resize_cb), self, G_CONNECT_SWAPPED);
  g_signal_connect_object (self->section_view, "notify::selected",
                           G_CALLBACK (on_section_selected_cb), self, G_CONNECT_SWAPPED);
  g_signal_connect_object (self->section_view, "notify::show-temperatures",
                           G_CALLBACK (on_show_temperatures_cb), self, G_CONNECT_SWAPPED);
  g_signal_connect_object (self->layer_list, "row-selected",
                           G_CALLBACK (on_row_selected_cb), self, G_CONNECT_SWAPPED);
  /* + and − on a selected layer row resize it, as in the section (an
   * entry in the row keeps its own keys: it handles them first). */
  key = gtk_event_controller_key_new ();
  g_signal_connect_object (key, "key-pressed", G_CALLBACK (on_layer_list_key_pressed_cb), self, G_CONNECT_SWAPPED);
  gtk_widget_add_controller (GTK_WIDGET (self->layer_list), key);
  g_signal_connect_object (self->results_view, "conditions-changed",
                           G_CALLBACK (on_conditions_changed_cb), self, G_CONNECT_SWAPPED);
  g_signal_connect_object (self->code_entry, "activate",
                           G_CALLBACK (on_name_activate_cb), self, G_CONNECT_SWAPPED);
  g_signal_connect_object (self->name_entry, "activate",
                           G_CALLBACK (on_name_activate_cb), self, G_CONNECT_SWAPPED);
  focus = gtk_event_controller_focus_new ();
  g_signal_connect_object (focus, "leave", G_CALLBACK (on_name_focus_leave_cb), self, G_CONNECT_SWAPPED);
  gtk_widget_add_controller (GTK_WIDGET (self->name_entry), focus);
  focus = gtk_event_controller_focus_new ();
  g_signal_connect_object (focus, "leave", G_CALLBACK (on_name_focus_leave_cb), self, G_CONNECT_SWAPPED);
  gtk_widget_add_controller (GTK_WIDGET (self->code_entry), focus);

  update_actions (self);
}

void
lamina_editor_set_document (LaminaEditor   *self,
                            LaminaDocument *document)
{
  g_return_if_fail (LAMINA_IS_EDITOR (self));

  if (self->document == document)
    return;
  if (self->document != NULL)
    g_clear_signal_handler (&self->changed_id, self->document);
  lamina_properties_view_set_document (self->properties_view, document);
  lamina_method_view_set_document (self->method_view, document);
  g_set_object (&self->document, document);
  if (document != NULL)
    {
      self->changed_id = g_signal_connect_object (document, "changed",
                                                  G_CALLBACK (on_document_changed_cb), self,
                                                  G_CONNECT_SWAPPED);
      lamina_section_view_set_construction (self->section_view, NULL, NULL);
      lamina_section_view_set_selected (self->section_view, 0);
      lamina_section_view_set_zoom (self->section_view, 1.0);
      self->flag_revision = -1;
      refresh (self);
    }
  else
    lamina_section_view_set_construction (self->section_view, NULL, NULL);
}

LaminaDocument *
lamina_editor_get_document (LaminaEditor *self)
{
  g_return_val_if_fail (LAMINA_IS_EDITOR (self), NULL);
  return self->document;
}

LaminaSectionView *
lamina_editor_get_section_view (LaminaEditor *self)
{
  g_return_val_if_fail (LAMINA_IS_EDITOR (self), NULL);
  return self->section_view;
}

GtkWidget *
lamina_editor_get_method_view (LaminaEditor *self)
{
  g_return_val_if_fail (LAMINA_IS_EDITOR (self), NULL);
  return GTK_WIDGET (self->method_view);
}

LaminaPropertiesView *
lamina_editor_get_properties_view (LaminaEditor *self)
{
  g_return_val_if_fail (LAMINA_IS_EDITOR (self), NULL);
  return self->properties_view;
}

/* "layers" or "construction". */
void
lamina_editor_show_page (LaminaEditor *self,
                         const char   *name)
{
  g_return_if_fail (LAMINA_IS_EDITOR (self));
  gtk_stack_set_visible_child_name (self->page_stack, name);
}

LaminaMoistureView *
lamina_editor_get_moisture_view (LaminaEditor *self)
{
  g_return_val_if_fail (LAMINA_IS_EDITOR (self), NULL);
  return self->moisture_view;
}

/* "results" or "moisture", the pages of the side panel. */
void
lamina_editor_show_results_page (LaminaEditor *self,
                                 const char   *name)
{
  g_return_if_fail (LAMINA_IS_EDITOR (self));
  gtk_stack_set_visible_child_name (self->results_stack, name);
}

LaminaResultsView *
lamina_editor_get_results_view (LaminaEditor *self)
{
  g_return_val_if_fail (LAMINA_IS_EDITOR (self), NULL);
  return self->results_view;
}

void
lamina_editor_set_snap_step (LaminaEditor *self,
                             double        step)
{
  g_return_if_fail (LAMINA_IS_EDITOR (self));
  self->snap_step = step;
  lamina_section_view_set_snap_step (self->section_view, step);
  refresh (self);
}
