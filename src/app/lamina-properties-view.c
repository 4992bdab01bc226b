/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "lamina-app"

#include "config.h"

#include "lamina-properties-view-private.h"

#include <glib/gi18n.h>

#include "lamina-editor-state.h"
#include "lamina-library-safety.h"
#include "lamina-text.h"

/* Typing in the notes is saved after this pause (and when focus leaves),
 * one undo step per stretch of typing. */
#define NOTES_SAVE_DELAY_MS 800

G_DEFINE_FINAL_TYPE (LaminaPropertiesView, lamina_properties_view, GTK_TYPE_WIDGET)

static const LaminaConstruction *
get_state (LaminaPropertiesView *self)
{
  return self->document ? lamina_document_get_construction (self->document) : NULL;
}

static void
show_error (GtkLabel     *label,
            const GError *error)
{
  gtk_label_set_text (label, error ? error->message : "");
  gtk_widget_set_visible (GTK_WIDGET (label), error != NULL);
}

/* Applies a pure edit's result; a refusal is shown in @error_label, next
 * to the field it concerns. */
static gboolean
apply (LaminaPropertiesView *self,
       LaminaConstruction   *next,
       const char           *group,
       const GError         *error,
       GtkLabel             *error_label)
{
  show_error (error_label, next == NULL ? error : NULL);
  if (next == NULL)
    return FALSE;
  lamina_document_apply (self->document, next, group, LAMINA_APPLY_DEFAULT);
  return TRUE;
}

static void
on_element_selected_cb (LaminaPropertiesView *self)
{
  const LaminaConstruction *state = get_state (self);
  guint element = gtk_drop_down_get_selected (self->element_dropdown);
  g_autoptr(GError) error = NULL;
  LaminaConstruction *next;

  if (self->updating || state == NULL || element == GTK_INVALID_LIST_POSITION ||
      element == (guint) state->element)
    return;
  next = lamina_edit_set_element (state, (LaminaElement) element, &error);
  apply (self, next, NULL, error, self->field_error);
}

/* Item 0 is "the element's default"; items 1… are the directions. */
static void
on_heat_flow_selected_cb (LaminaPropertiesView *self)
{
  const LaminaConstruction *state = get_state (self);
  guint selected = gtk_drop_down_get_selected (self->heat_flow_dropdown);
  g_autoptr(GError) error = NULL;
  LaminaConstruction *next;
  LaminaHeatFlow heat_flow;

  if (self->updating || state == NULL || selected == GTK_INVALID_LIST_POSITION)
    return;
  heat_flow = selected == 0 ? lamina_element_default_heat_flow (state->element)
                            : (LaminaHeatFlow) (selected - 1);
  if (heat_flow == state->heat_flow)
    return;
  next = lamina_edit_set_heat_flow (state, heat_flow, &error);
  apply (self, next, NULL, error, self->field_error);
}

static void
on_outer_side_selected_cb (LaminaPropertiesView *self)
{
  const LaminaConstruction *state = get_state (self);
  guint selected = gtk_drop_down_get_selected (self->outer_side_dropdown);
  g_autoptr(GError) error = NULL;
  LaminaConstruction *next;

  if (self->updating || state == NULL || selected == GTK_INVALID_LIST_POSITION ||
      selected == (guint) state->outer_side)
    return;
  next = lamina_edit_set_outer_side (state, (LaminaOuterSide) selected, &error);
  apply (self, next, NULL, error, self->field_error);
}

static void
commit_description (LaminaPropertiesView *self)
{
  const LaminaConstruction *state = get_state (self);
  const char *text = gtk_editable_get_text (GTK_EDITABLE (self->description_entry));
  g_autoptr(GError) error = NULL;
  LaminaConstruction *next;

  if (self->updating || state == NULL ||
      g_strcmp0 (text, state->description ? state->description : "") == 0)
    return;
  next = lamina_edit_set_names (state, NULL, NULL, text, &error);
  if (next == NULL)
    gtk_widget_add_css_class (GTK_WIDGET (self->description_entry), "error");
  else
    gtk_widget_remove_css_class (GTK_WIDGET (self->description_entry), "error");
  apply (self, next, NULL, error, self->field_error);
}

static char *
dup_notes_text (LaminaPropertiesView *self)
{
  GtkTextBuffer *buffer = gtk_text_view_get_buffer (self->notes_view);
  GtkTextIter start, end;

  gtk_text_buffer_get_bounds (buffer, &start, &end);
  return gtk_text_buffer_get_text (buffer, &start, &end, FALSE);
}

static void
commit_notes (LaminaPropertiesView *self)
{
  const LaminaConstruction *state = get_state (self);
  g_autofree char *text = NULL;
  g_autofree char *group = NULL;
  g_autoptr(GError) error = NULL;
  LaminaConstruction *next;

  g_clear_handle_id (&self->notes_timeout, g_source_remove);
  if (state == NULL)
    return;
  text = dup_notes_text (self);
  if (g_strcmp0 (text, state->notes ? state->notes : "") == 0)
    return;
  group = g_strdup_printf ("notes-%u", self->notes_serial);
  next = lamina_edit_set_notes (state, text, &error);
  apply (self, next, group, error, self->field_error);
}

static gboolean
on_notes_timeout_cb (gpointer data)
{
  LaminaPropertiesView *self = data;

  self->notes_timeout = 0;
  commit_notes (self);
  return G_SOURCE_REMOVE;
}

static void
on_notes_changed_cb (LaminaPropertiesView *self)
{
  if (self->updating)
    return;
  g_clear_handle_id (&self->notes_timeout, g_source_remove);
  self->notes_timeout = g_timeout_add (NOTES_SAVE_DELAY_MS, on_notes_timeout_cb, self);
}

static void
on_notes_focus_leave_cb (LaminaPropertiesView *self)
{
  commit_notes (self);
  self->notes_serial++;
}

static void
add_tag_action (GtkWidget  *widget,
                const char *action_name,
                GVariant   *parameter)
{
  LaminaPropertiesView *self = LAMINA_PROPERTIES_VIEW (widget);
  const LaminaConstruction *state = get_state (self);
  g_autoptr(GError) error = NULL;
  LaminaConstruction *next;

  if (state == NULL)
    return;
  next = lamina_edit_add_tag (state, gtk_editable_get_text (GTK_EDITABLE (self->tag_entry)), &error);
  if (apply (self, next, NULL, error, self->tag_error))
    gtk_editable_set_text (GTK_EDITABLE (self->tag_entry), "");
}

static void
remove_tag_action (GtkWidget  *widget,
                   const char *action_name,
                   GVariant   *parameter)
{
  LaminaPropertiesView *self = LAMINA_PROPERTIES_VIEW (widget);
  const LaminaConstruction *state = get_state (self);
  g_autoptr(GError) error = NULL;
  LaminaConstruction *next;

  if (state == NULL)
    return;
  next = lamina_edit_remove_tag (state, g_variant_get_string (parameter, NULL), &error);
  apply (self, next, NULL, error, self->tag_error);
}

static void
on_tag_activate_cb (LaminaPropertiesView *self)
{
  gtk_widget_activate_action (GTK_WIDGET (self), "properties.add-tag", NULL);
}

static GtkWidget *
new_tag_chip (const char *tag)
{
  GtkWidget *box = gtk_box_new (GTK_ORIENTATION_HORIZONTAL, 2);
  GtkWidget *label = gtk_label_new (tag);
  GtkWidget *remove = gtk_button_new_from_icon_name ("window-close-symbolic");
  g_autofree char *accessible = g_strdup_printf (_("Remove tag “%s”"), tag);

  gtk_label_set_ellipsize (GTK_LABEL (label), PANGO_ELLIPSIZE_END);
  gtk_label_set_max_width_chars (GTK_LABEL (label), 24);
  gtk_widget_add_css_class (remove, "flat");
  gtk_widget_add_css_class (remove, "circular");
  gtk_widget_set_tooltip_text (remove, accessible);
  gtk_accessible_update_property (GTK_ACCESSIBLE (remove), GTK_ACCESSIBLE_PROPERTY_LABEL, accessible, -1);
  gtk_actionable_set_action_name (GTK_ACTIONABLE (remove), "properties.remove-tag");
  gtk_actionable_set_action_target (GTK_ACTIONABLE (remove), "s", tag);
  gtk_box_append (GTK_BOX (box), label);
  gtk_box_append (GTK_BOX (box), remove);
  gtk_widget_add_css_class (box, "lamina-tag");
  return box;
}

static gboolean
same_tags (GStrv      shown,
           GPtrArray *tags)
{
  guint n = shown ? g_strv_length (shown) : 0;

  if (n != tags->len)
    return FALSE;
  for (guint i = 0; i < n; i++)
    if (g_strcmp0 (shown[i], tags->pdata[i]) != 0)
      return FALSE;
  return TRUE;
}

static void
update_tags (LaminaPropertiesView     *self,
             const LaminaConstruction *state)
{
  GtkWidget *child;
  g_autoptr(GStrvBuilder) builder = g_strv_builder_new ();

  if (same_tags (self->shown_tags, state->tags))
    return;
  while ((child = gtk_widget_get_first_child (GTK_WIDGET (self->tag_box))) != NULL)
    gtk_flow_box_remove (self->tag_box, child);
  for (guint i = 0; i < state->tags->len; i++)
    {
      gtk_flow_box_append (self->tag_box, new_tag_chip (state->tags->pdata[i]));
      /* Pills sit side by side from the start of the line, not spread over it. */
      gtk_widget_set_halign (gtk_widget_get_last_child (GTK_WIDGET (self->tag_box)), GTK_ALIGN_START);
      g_strv_builder_add (builder, state->tags->pdata[i]);
    }
  gtk_widget_set_visible (GTK_WIDGET (self->tag_box), state->tags->len > 0);
  g_clear_pointer (&self->shown_tags, g_strfreev);
  self->shown_tags = g_strv_builder_end (builder);
}

static gboolean
is_editing (GtkWidget *widget)
{
  return gtk_widget_has_focus (widget) || gtk_widget_is_focus (widget);
}

static void
update_heat_flow (LaminaPropertiesView     *self,
                  const LaminaConstruction *state)
{
  LaminaHeatFlow preset = lamina_element_default_heat_flow (state->element);

  if (self->shown_element != (int) state->element)
    {
      g_autofree char *text = NULL;
      const char *items[2] = { NULL, NULL };

      /* Translators: %s is a direction, e.g. "Upward". */
      text = g_strdup_printf (_("Element default (%s)"), lamina_text_heat_flow_name (preset));
      items[0] = text;
      gtk_string_list_splice (self->heat_flows, 0, 1, items);
      self->shown_element = (int) state->element;
    }
  gtk_drop_down_set_selected (self->heat_flow_dropdown,
                              state->heat_flow == preset ? 0 : (guint) state->heat_flow + 1);
}

/* A read-only library: the properties show but take no edit. */
static void
set_writable (LaminaPropertiesView *self,
              gboolean              writable)
{
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "properties.add-tag", writable);
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "properties.remove-tag", writable);
  gtk_editable_set_editable (GTK_EDITABLE (self->description_entry), writable);
  gtk_editable_set_editable (GTK_EDITABLE (self->tag_entry), writable);
  gtk_text_view_set_editable (self->notes_view, writable);
  gtk_widget_set_sensitive (GTK_WIDGET (self->element_dropdown), writable);
  gtk_widget_set_sensitive (GTK_WIDGET (self->outer_side_dropdown), writable);
  gtk_widget_set_sensitive (GTK_WIDGET (self->heat_flow_dropdown), writable);
}

void
lamina_properties_view_update (LaminaPropertiesView     *self,
                               const LaminaConstruction *state,
                               const LaminaResult       *result)
{
  g_autofree char *notes = NULL;

  g_return_if_fail (LAMINA_IS_PROPERTIES_VIEW (self));

  if (state == NULL)
    return;
  self->updating = TRUE;
  set_writable (self, self->document != NULL
                      && !lamina_library_is_read_only (lamina_document_get_library (self->document)));
  gtk_drop_down_set_selected (self->element_dropdown, (guint) state->element);
  update_heat_flow (self, state);
  gtk_drop_down_set_selected (self->outer_side_dropdown, (guint) state->outer_side);
  if (result != NULL)
    {
      g_autofree char *rsi = lamina_text_number (result->rsi, 2);
      g_autofree char *rse = lamina_text_number (result->rse, 2);
      /* Translators: the surface resistances, e.g. "Rsi 0.13 · Rse 0.04 m²·K/W". */
      g_autofree char *text = g_strdup_printf (_("Rsi %s · Rse %s m²·K/W"), rsi, rse);

      gtk_label_set_text (self->surface_label, text);
    }
  else
    gtk_label_set_text (self->surface_label, "");
  if (!is_editing (GTK_WIDGET (self->description_entry)) &&
      g_strcmp0 (gtk_editable_get_text (GTK_EDITABLE (self->description_entry)),
                 state->description ? state->description : "") != 0)
    gtk_editable_set_text (GTK_EDITABLE (self->description_entry), state->description ? state->description : "");
  update_tags (self, state);
  notes = dup_notes_text (self);
  if (!is_editing (GTK_WIDGET (self->notes_view)) && g_strcmp0 (notes, state->notes ? state->notes : "") != 0)
    gtk_text_buffer_set_text (gtk_text_view_get_buffer (self->notes_view), state->notes ? state->notes : "", -1);
  self->updating = FALSE;
}

void
lamina_properties_view_commit (LaminaPropertiesView *self)
{
  g_return_if_fail (LAMINA_IS_PROPERTIES_VIEW (self));

  commit_description (self);
  commit_notes (self);
}

void
lamina_properties_view_set_document (LaminaPropertiesView *self,
                                     LaminaDocument       *document)
{
  g_return_if_fail (LAMINA_IS_PROPERTIES_VIEW (self));

  if (self->document == document)
    return;
  /* What was typed belongs to the construction it was typed for. */
  if (self->document != NULL)
    lamina_properties_view_commit (self);
  g_set_object (&self->document, document);
  show_error (self->field_error, NULL);
  show_error (self->tag_error, NULL);
  gtk_editable_set_text (GTK_EDITABLE (self->tag_entry), "");
  gtk_widget_remove_css_class (GTK_WIDGET (self->description_entry), "error");
}

static void
lamina_properties_view_dispose (GObject *object)
{
  LaminaPropertiesView *self = LAMINA_PROPERTIES_VIEW (object);

  g_clear_handle_id (&self->notes_timeout, g_source_remove);
  g_clear_object (&self->document);
  g_clear_object (&self->heat_flows);
  g_clear_pointer (&self->shown_tags, g_strfreev);
  gtk_widget_dispose_template (GTK_WIDGET (self), LAMINA_TYPE_PROPERTIES_VIEW);

  G_OBJECT_CLASS (lamina_properties_view_parent_class)->dispose (object);
}

static void
lamina_properties_view_class_init (LaminaPropertiesViewClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->dispose = lamina_properties_view_dispose;

  gtk_widget_class_set_template_from_resource (widget_class, "/org/example/Lamina/lamina-properties-view.ui");
  gtk_widget_class_bind_template_child (widget_class, LaminaPropertiesView, scroller);
  gtk_widget_class_bind_template_child (widget_class, LaminaPropertiesView, element_dropdown);
  gtk_widget_class_bind_template_child (widget_class, LaminaPropertiesView, heat_flow_dropdown);
  gtk_widget_class_bind_template_child (widget_class, LaminaPropertiesView, surface_label);
  gtk_widget_class_bind_template_child (widget_class, LaminaPropertiesView, outer_side_dropdown);
  gtk_widget_class_bind_template_child (widget_class, LaminaPropertiesView, description_entry);
  gtk_widget_class_bind_template_child (widget_class, LaminaPropertiesView, tag_box);
  gtk_widget_class_bind_template_child (widget_class, LaminaPropertiesView, tag_entry);
  gtk_widget_class_bind_template_child (widget_class, LaminaPropertiesView, tag_error);
  gtk_widget_class_bind_template_child (widget_class, LaminaPropertiesView, notes_view);
  gtk_widget_class_bind_template_child (widget_class, LaminaPropertiesView, field_error);
  gtk_widget_class_set_layout_manager_type (widget_class, GTK_TYPE_BIN_LAYOUT);
  gtk_widget_class_set_css_name (widget_class, "lamina-properties-view");

  gtk_widget_class_install_action (widget_class, "properties.add-tag", NULL, add_tag_action);
  gtk_widget_class_install_action (widget_class, "properties.remove-tag", "s", remove_tag_action);
}

static void
lamina_properties_view_init (LaminaPropertiesView *self)
{
  const char *directions[LAMINA_N_HEAT_FLOWS + 2] = { "" };
  GtkEventController *focus;

  gtk_widget_init_template (GTK_WIDGET (self));
  self->shown_element = -1;

  for (guint i = 0; i < LAMINA_N_HEAT_FLOWS; i++)
    directions[i + 1] = lamina_text_heat_flow_name ((LaminaHeatFlow) i);
  self->heat_flows = gtk_string_list_new (directions);
  gtk_drop_down_set_model (self->heat_flow_dropdown, G_LIST_MODEL (self->heat_flows));

  g_signal_connect_object (self->element_dropdown, "notify::selected",
                           G_CALLBACK (on_element_selected_cb), self, G_CONNECT_SWAPPED);
  g_signal_connect_object (self->heat_flow_dropdown, "notify::selected",
                           G_CALLBACK (on_heat_flow_selected_cb), self, G_CONNECT_SWAPPED);
  g_signal_connect_object (self->outer_side_dropdown, "notify::selected",
                           G_CALLBACK (on_outer_side_selected_cb), self, G_CONNECT_SWAPPED);
  g_signal_connect_object (self->description_entry, "activate",
                           G_CALLBACK (commit_description), self, G_CONNECT_SWAPPED);
  focus = gtk_event_controller_focus_new ();
  g_signal_connect_object (focus, "leave", G_CALLBACK (commit_description), self, G_CONNECT_SWAPPED);
  gtk_widget_add_controller (GTK_WIDGET (self->description_entry), focus);
  g_signal_connect_object (self->tag_entry, "activate",
                           G_CALLBACK (on_tag_activate_cb), self, G_CONNECT_SWAPPED);
  g_signal_connect_object (gtk_text_view_get_buffer (self->notes_view), "changed",
                           G_CALLBACK (on_notes_changed_cb), self, G_CONNECT_SWAPPED);
  focus = gtk_event_controller_focus_new ();
  g_signal_connect_object (focus, "leave", G_CALLBACK (on_notes_focus_leave_cb), self, G_CONNECT_SWAPPED);
  gtk_widget_add_controller (GTK_WIDGET (self->notes_view), focus);
}
