/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "lamina-app"

#include "config.h"

#include "lamina-settings.h"
#include "lamina-window-private.h"

#include <glib/gi18n.h>
#include <math.h>

#include "lamina-construction-item.h"
#include "lamina-library-row.h"
#include "lamina-safety-bar.h"
#include "lamina-number.h"
#include "lamina-text.h"

G_DEFINE_FINAL_TYPE (LaminaWindow, lamina_window, GTK_TYPE_APPLICATION_WINDOW)

/* List rows */

static void
on_row_setup_cb (GtkSignalListItemFactory *factory,
                 GtkListItem              *item,
                 LaminaWindow             *self)
{
  gtk_list_item_set_child (item, lamina_library_row_new ());
}

static void
on_row_bind_cb (GtkSignalListItemFactory *factory,
                GtkListItem              *item,
                LaminaWindow             *self)
{
  LaminaConstructionItem *row = gtk_list_item_get_item (item);

  if (row != NULL)
    lamina_library_row_set_summary (LAMINA_LIBRARY_ROW (gtk_list_item_get_child (item)),
                                    lamina_construction_item_get_summary (row));
}

/* Selection */

static void
on_document_notice_cb (LaminaWindow *self,
                       const char   *message)
{
  lamina_window_notify (self, message);
  lamina_window_refresh_list (self);
}

static void
on_document_conflict_cb (LaminaWindow *self)
{
  const char *conflict = self->document ? lamina_document_get_conflict (self->document) : NULL;

  if (conflict != NULL)
    {
      g_autofree char *text = g_strdup_printf (_("Not saved: %s. Your version is kept on screen."), conflict);

      gtk_label_set_text (self->banner_label, text);
    }
  gtk_revealer_set_reveal_child (self->banner_revealer, conflict != NULL);
  lamina_window_update_actions (self);
}

static void
on_document_changed_cb (LaminaWindow *self)
{
  lamina_window_update_actions (self);
}

/* The name a revision is saved under: the one in the preferences, else
 * the person's full name from the system, never a login name. */
static char *
dup_person_name (LaminaWindow *self)
{
  g_autofree char *name = g_settings_get_string (self->settings, "reviewer-name");
  const char *real = g_get_real_name ();

  if (name != NULL && *g_strstrip (name) != '\0')
    return g_steal_pointer (&name);
  if (real != NULL && *real != '\0' && g_strcmp0 (real, "Unknown") != 0 && g_strcmp0 (real, g_get_user_name ()) != 0)
    return g_strdup (real);
  return NULL;
}

static void
set_document (LaminaWindow   *self,
              LaminaDocument *document)
{
  if (self->document != NULL)
    g_signal_handlers_disconnect_by_data (self->document, self);
  g_set_object (&self->document, document);
  if (document != NULL)
    {
      g_autofree char *reviewer = dup_person_name (self);

      lamina_document_set_author (document, reviewer);
      g_signal_connect_object (document, "notice", G_CALLBACK (on_document_notice_cb), self, G_CONNECT_SWAPPED);
      g_signal_connect_object (document, "notify::conflict", G_CALLBACK (on_document_conflict_cb), self, G_CONNECT_SWAPPED);
      g_signal_connect_object (document, "changed", G_CALLBACK (on_document_changed_cb), self, G_CONNECT_SWAPPED);
      lamina_window_watch_document (self, document);
    }
  lamina_editor_set_document (self->editor, document);
  lamina_change_banner_set_document (self->change_banner, document);
  gtk_stack_set_visible_child_name (self->main_stack, document ? "editor" : "empty");
  on_document_conflict_cb (self);
  lamina_window_update_actions (self);
}

gboolean
lamina_window_open (LaminaWindow  *self,
                    const char    *id,
                    GError       **error)
{
  g_autoptr(LaminaDocument) document = NULL;
  int position;

  g_return_val_if_fail (LAMINA_IS_WINDOW (self), FALSE);

  if (self->document != NULL)
    lamina_document_commit (self->document, NULL);
  /* Its edits may still wait for the library: show them, not the stored
   * state they will replace. */
  document = lamina_window_dup_held_document (self, id);
  if (document == NULL)
    document = lamina_document_new (self->library, id, error);
  if (document == NULL)
    return FALSE;
  set_document (self, document);

  position = lamina_construction_list_find (self->list, id);
  if (position >= 0 && gtk_single_selection_get_selected (self->selection) != (guint) position)
    {
      self->selecting = TRUE;
      gtk_single_selection_set_selected (self->selection, (guint) position);
      self->selecting = FALSE;
    }
  return TRUE;
}

static void
on_selection_changed_cb (LaminaWindow *self)
{
  LaminaConstructionItem *item = gtk_single_selection_get_selected_item (self->selection);
  g_autoptr(GError) error = NULL;

  if (self->selecting || item == NULL)
    return;
  if (self->document != NULL &&
      g_strcmp0 (lamina_document_get_id (self->document), lamina_construction_item_get_id (item)) == 0)
    return;
  if (!lamina_window_open (self, lamina_construction_item_get_id (item), &error))
    lamina_window_notify (self, error->message);
}

static gboolean
is_filtered (const LaminaLibraryQuery *q)
{
  return (q->text != NULL && !lamina_text_is_blank (q->text)) || q->element >= 0 || q->status >= 0
         || q->tag != NULL || !isnan (q->min_u) || !isnan (q->max_u) || !isnan (q->min_thickness)
         || !isnan (q->max_thickness) || q->material_changed_only || q->moisture_fails_only;
}

/* The number of rows, or why the library could not be read (a busy or
 * damaged file, a closed library): an empty list must not pass for an
 * empty result. */
static void
update_count (LaminaWindow *self)
{
  guint n = g_list_model_get_n_items (G_LIST_MODEL (self->list));
  const char *error = lamina_construction_list_get_error (self->list);
  g_autofree char *text = NULL;

  if (error != NULL)
    {
      text = g_strdup_printf (_("The library could not be read: %s"), error);
      gtk_widget_add_css_class (GTK_WIDGET (self->count_label), "lamina-error");
      gtk_widget_remove_css_class (GTK_WIDGET (self->count_label), "dim-label");
      gtk_label_set_wrap (self->count_label, TRUE);
    }
  else
    {
      LaminaLibraryQuery q, all;
      gint64 total = -1;

      gboolean exact = lamina_construction_list_is_count_exact (self->list);

      lamina_construction_list_get_query (self->list, &q);
      lamina_library_query_init (&all);
      if (is_filtered (&q))
        {
          if (self->library_total < 0)
            self->library_total = lamina_library_count (self->library, &all, NULL);
          total = self->library_total;
        }
      /* "1000+ constructions": a count that stopped early; a click counts
       * them all. */
      if (!exact && total >= 0)
        text = g_strdup_printf (g_dngettext (NULL, "%u+ of %u construction", "%u+ of %u constructions", (gulong) total),
                                LAMINA_CONSTRUCTION_LIST_COUNT_BOUND, (guint) total);
      else if (!exact)
        text = g_strdup_printf (_("%u+ constructions"), LAMINA_CONSTRUCTION_LIST_COUNT_BOUND);
      /* "4 of 20 constructions" while a filter narrows the list. */
      else if (total >= 0)
        text = g_strdup_printf (g_dngettext (NULL, "%u of %u construction", "%u of %u constructions", (gulong) total),
                                n, (guint) total);
      else
        text = g_strdup_printf (g_dngettext (NULL, "%u construction", "%u constructions", n), n);
      gtk_widget_remove_css_class (GTK_WIDGET (self->count_label), "lamina-error");
      gtk_widget_add_css_class (GTK_WIDGET (self->count_label), "dim-label");
    }
  gtk_label_set_text (self->count_label, text);
  gtk_widget_set_tooltip_text (GTK_WIDGET (self->count_label),
                               error != NULL ? text
                               : !lamina_construction_list_is_count_exact (self->list) ? _("Click to count every match")
                               : NULL);
}

static void
on_count_pressed_cb (LaminaWindow *self)
{
  lamina_construction_list_count_exactly (self->list);
}

/* The list grew at its end: a count that had stopped early was completed
 * (scrolled near the end or clicked).  A new query starts at 0 and is
 * counted by sync_selection. */
static void
on_list_items_changed_cb (LaminaWindow *self,
                          guint         position,
                          guint         removed,
                          guint         added)
{
  if (position > 0 && removed == 0)
    update_count (self);
}

/* After the list changed: select the open construction's row again. */
static void
sync_selection (LaminaWindow *self)
{
  const char *id = self->document ? lamina_document_get_id (self->document) : NULL;
  int position;

  self->selecting = TRUE;
  position = id ? lamina_construction_list_find (self->list, id) : -1;
  gtk_single_selection_set_selected (self->selection,
                                     position >= 0 ? (guint) position : GTK_INVALID_LIST_POSITION);
  self->selecting = FALSE;
  update_count (self);
  lamina_window_update_actions (self);
}

void
lamina_window_refresh_list (LaminaWindow *self)
{
  self->library_total = -1;
  lamina_construction_list_refresh (self->list);
  sync_selection (self);
}

/* Filters */

static void
run_search (LaminaWindow *self)
{
  const char *text = gtk_editable_get_text (GTK_EDITABLE (self->search_entry));

  g_clear_handle_id (&self->search_idle, g_source_remove);
  self->selecting = TRUE;
  lamina_construction_list_set_text (self->list, text);
  self->selecting = FALSE;
  sync_selection (self);
}

static gboolean
search_idle_cb (gpointer data)
{
  LaminaWindow *self = data;

  self->search_idle = 0;
  run_search (self);
  return G_SOURCE_REMOVE;
}

/* Typing ahead replaces the search not yet run: the search waits in an
 * idle behind the input events already queued, so keys typed while the
 * last page was read are taken together, and only the latest text is
 * searched (no backlog of stale searches). */
static void
on_search_changed_cb (LaminaWindow *self)
{
  if (self->search_idle == 0)
    self->search_idle = g_idle_add (search_idle_cb, self);
}

void
lamina_window_set_search (LaminaWindow *self,
                          const char   *text)
{
  g_return_if_fail (LAMINA_IS_WINDOW (self));
  gtk_editable_set_text (GTK_EDITABLE (self->search_entry), text);
  run_search (self);
}

/* An empty bound is open; a bad one is marked and ignored. */
static void
read_u_bound (GtkEntry *entry,
              double   *value)
{
  const char *text = gtk_editable_get_text (GTK_EDITABLE (entry));
  g_autoptr(GError) error = NULL;

  *value = NAN;
  if (lamina_text_is_blank (text) || lamina_number_parse (LAMINA_FIELD_U_FILTER, text, value, &error))
    {
      gtk_widget_remove_css_class (GTK_WIDGET (entry), "error");
      gtk_widget_set_tooltip_text (GTK_WIDGET (entry), NULL);
      return;
    }
  *value = NAN;
  gtk_widget_add_css_class (GTK_WIDGET (entry), "error");
  gtk_widget_set_tooltip_text (GTK_WIDGET (entry), error->message);
}

static void
on_u_chip_clicked_cb (LaminaWindow *self)
{
  gtk_editable_set_text (GTK_EDITABLE (self->min_u_entry), "");
  gtk_editable_set_text (GTK_EDITABLE (self->max_u_entry), "");
}

static void
on_tag_chip_clicked_cb (LaminaWindow *self)
{
  gtk_drop_down_set_selected (self->tag_filter, 0);
}

static void
on_moisture_chip_clicked_cb (LaminaWindow *self)
{
  gtk_check_button_set_active (self->moisture_filter, FALSE);
}

/* A chip that says @text and clears its filter by @clear_cb. */
static void
add_chip (LaminaWindow *self,
          GCallback     clear_cb,
          const char   *text)
{
  GtkWidget *chip = gtk_button_new ();
  GtkWidget *box = gtk_box_new (GTK_ORIENTATION_HORIZONTAL, 4);
  g_autofree char *tooltip = g_strdup_printf (_("Remove the filter “%s”"), text);

  gtk_box_append (GTK_BOX (box), gtk_label_new (text));
  gtk_box_append (GTK_BOX (box), gtk_image_new_from_icon_name ("window-close-symbolic"));
  gtk_button_set_child (GTK_BUTTON (chip), box);
  gtk_widget_set_tooltip_text (chip, tooltip);
  gtk_widget_add_css_class (chip, "lamina-filter-chip");
  gtk_widget_add_css_class (chip, "pill");
  g_signal_connect_object (chip, "clicked", clear_cb, self, G_CONNECT_SWAPPED);
  gtk_flow_box_append (self->filter_chips, chip);
}

/* The filters that the dropdowns do not show themselves, as chips that
 * say what narrows the list and remove it with one click. */
static void
update_chips (LaminaWindow *self,
              double        min_u,
              double        max_u)
{
  guint tag = gtk_drop_down_get_selected (self->tag_filter);
  GtkWidget *child;

  while ((child = gtk_widget_get_first_child (GTK_WIDGET (self->filter_chips))) != NULL)
    gtk_flow_box_remove (self->filter_chips, child);
  if (!isnan (min_u) || !isnan (max_u))
    {
      g_autofree char *lo = isnan (min_u) ? NULL : lamina_text_number (min_u, 2);
      g_autofree char *hi = isnan (max_u) ? NULL : lamina_text_number (max_u, 2);
      g_autofree char *text = lo && hi ? g_strdup_printf (_("U %s to %s W/(m²·K)"), lo, hi)
                              : lo ? g_strdup_printf (_("U ≥ %s W/(m²·K)"), lo)
                              : g_strdup_printf (_("U ≤ %s W/(m²·K)"), hi);

      add_chip (self, G_CALLBACK (on_u_chip_clicked_cb), text);
    }
  if (tag > 0 && tag != GTK_INVALID_LIST_POSITION && self->tags != NULL && tag <= self->tags->len)
    {
      g_autofree char *text = g_strdup_printf (_("Tag: %s"), (const char *) g_ptr_array_index (self->tags, tag - 1));

      add_chip (self, G_CALLBACK (on_tag_chip_clicked_cb), text);
    }
  if (gtk_check_button_get_active (self->moisture_filter))
    add_chip (self, G_CALLBACK (on_moisture_chip_clicked_cb), _("Fails its moisture check"));
  gtk_widget_set_visible (GTK_WIDGET (self->filter_chips),
                          gtk_widget_get_first_child (GTK_WIDGET (self->filter_chips)) != NULL);
}

static void
on_filters_changed_cb (LaminaWindow *self)
{
  guint element = gtk_drop_down_get_selected (self->element_filter);
  guint status = gtk_drop_down_get_selected (self->status_filter);
  guint sort = gtk_drop_down_get_selected (self->sort_dropdown);
  guint tag = gtk_drop_down_get_selected (self->tag_filter);
  double min_u = NAN, max_u = NAN;
  static const LaminaSortKey sorts[] = {
    LAMINA_SORT_CODE, LAMINA_SORT_NAME, LAMINA_SORT_U, LAMINA_SORT_THICKNESS, LAMINA_SORT_MODIFIED,
  };

  read_u_bound (self->min_u_entry, &min_u);
  read_u_bound (self->max_u_entry, &max_u);

  self->selecting = TRUE;
  lamina_construction_list_set_element (self->list, element == 0 || element == GTK_INVALID_LIST_POSITION ? -1 : (int) element - 1);
  lamina_construction_list_set_status (self->list, status == 0 || status == GTK_INVALID_LIST_POSITION ? -1 : (int) status - 1);
  lamina_construction_list_set_tag (self->list, tag == 0 || tag == GTK_INVALID_LIST_POSITION || self->tags == NULL || tag > self->tags->len
                                    ? NULL : g_ptr_array_index (self->tags, tag - 1));
  lamina_construction_list_set_u_range (self->list, min_u, max_u);
  lamina_construction_list_set_moisture_fails (self->list, gtk_check_button_get_active (self->moisture_filter));
  lamina_construction_list_set_sort (self->list, sorts[MIN (sort, G_N_ELEMENTS (sorts) - 1)],
                                     sort == 4 /* newest first */);
  self->selecting = FALSE;
  update_chips (self, min_u, max_u);
  sync_selection (self);
}

static void
set_strings (GtkDropDown *dropdown,
             const char  *first,
             ...)
{
  g_autoptr(GtkStringList) list = gtk_string_list_new (NULL);
  va_list args;

  va_start (args, first);
  for (const char *s = first; s != NULL; s = va_arg (args, const char *))
    gtk_string_list_append (list, s);
  va_end (args);
  gtk_drop_down_set_model (dropdown, G_LIST_MODEL (list));
}

static void
load_tags (LaminaWindow *self)
{
  g_autoptr(GtkStringList) list = gtk_string_list_new (NULL);

  if (self->tags_loaded)
    return;
  self->tags_loaded = TRUE;
  g_clear_pointer (&self->tags, g_ptr_array_unref);
  self->tags = lamina_library_list_tags (self->library, NULL);
  gtk_string_list_append (list, _("Any tag"));
  for (guint i = 0; self->tags != NULL && i < self->tags->len; i++)
    gtk_string_list_append (list, g_ptr_array_index (self->tags, i));
  gtk_drop_down_set_model (self->tag_filter, G_LIST_MODEL (list));
}

static void
setup_filters (LaminaWindow *self)
{
  GtkGesture *gesture;
  GtkEventController *focus;

  set_strings (self->element_filter, _("All elements"), _("Walls"), _("Roofs"), _("Floors"),
               _("Ceilings"), _("Partitions"), NULL);
  set_strings (self->status_filter, _("Any status"), C_("status", "Draft"), C_("status", "Checked"),
               C_("status", "Approved"), NULL);
  set_strings (self->sort_dropdown, _("Code"), _("Name"), _("U value"), _("Thickness"),
               _("Newest first"), NULL);
  set_strings (self->tag_filter, _("Any tag"), NULL);
  /* The tags of a large library take a query over every construction: run
   * it when the tag filter is first used (pointer, keyboard focus or its
   * activate signal), not before the first frame. */
  gesture = gtk_gesture_click_new ();
  gtk_event_controller_set_propagation_phase (GTK_EVENT_CONTROLLER (gesture), GTK_PHASE_CAPTURE);
  g_signal_connect_object (gesture, "pressed", G_CALLBACK (load_tags), self, G_CONNECT_SWAPPED);
  gtk_widget_add_controller (GTK_WIDGET (self->tag_filter), GTK_EVENT_CONTROLLER (gesture));
  focus = gtk_event_controller_focus_new ();
  g_signal_connect_object (focus, "enter", G_CALLBACK (load_tags), self, G_CONNECT_SWAPPED);
  gtk_widget_add_controller (GTK_WIDGET (self->tag_filter), focus);
  g_signal_connect_object (self->tag_filter, "activate", G_CALLBACK (load_tags), self, G_CONNECT_SWAPPED);

  g_signal_connect_object (self->search_entry, "search-changed", G_CALLBACK (on_search_changed_cb), self, G_CONNECT_SWAPPED);
  g_signal_connect_object (self->element_filter, "notify::selected", G_CALLBACK (on_filters_changed_cb), self, G_CONNECT_SWAPPED);
  g_signal_connect_object (self->status_filter, "notify::selected", G_CALLBACK (on_filters_changed_cb), self, G_CONNECT_SWAPPED);
  g_signal_connect_object (self->sort_dropdown, "notify::selected", G_CALLBACK (on_filters_changed_cb), self, G_CONNECT_SWAPPED);
  g_signal_connect_object (self->tag_filter, "notify::selected", G_CALLBACK (on_filters_changed_cb), self, G_CONNECT_SWAPPED);
  g_signal_connect_object (self->moisture_filter, "notify::active", G_CALLBACK (on_filters_changed_cb), self, G_CONNECT_SWAPPED);
  g_signal_connect_object (self->min_u_entry, "changed", G_CALLBACK (on_filters_changed_cb), self, G_CONNECT_SWAPPED);
  g_signal_connect_object (self->max_u_entry, "changed", G_CALLBACK (on_filters_changed_cb), self, G_CONNECT_SWAPPED);
}

/* Messages */

static gboolean
on_toast_timeout_cb (gpointer data)
{
  LaminaWindow *self = data;

  self->toast_timeout = 0;
  gtk_revealer_set_reveal_child (self->toast_revealer, FALSE);
  return G_SOURCE_REMOVE;
}

void
lamina_window_notify (LaminaWindow *self,
                      const char   *message)
{
  g_return_if_fail (LAMINA_IS_WINDOW (self));

  g_free (self->notice);
  self->notice = g_strdup (message);
  gtk_label_set_text (self->toast_label, message);
  gtk_widget_set_visible (self->toast_undo, FALSE);
  gtk_revealer_set_reveal_child (self->toast_revealer, TRUE);
  g_clear_handle_id (&self->toast_timeout, g_source_remove);
  self->toast_timeout = g_timeout_add_seconds (8, on_toast_timeout_cb, self);
}

void
lamina_window_show_undo_delete (LaminaWindow *self,
                                const char   *message,
                                const char   *id)
{
  lamina_window_notify (self, message);
  g_free (self->deleted_id);
  self->deleted_id = g_strdup (id);
  gtk_widget_set_visible (self->toast_undo, id != NULL);
  lamina_window_update_actions (self);
}

const char *
lamina_window_get_notice (LaminaWindow *self)
{
  g_return_val_if_fail (LAMINA_IS_WINDOW (self), NULL);
  return self->notice;
}

/* Window state */

static void
on_snap_step_changed_cb (LaminaWindow *self)
{
  lamina_editor_set_snap_step (self->editor, g_settings_get_double (self->settings, "snap-step"));
}

static void
on_reviewer_changed_cb (LaminaWindow *self)
{
  g_autofree char *reviewer = dup_person_name (self);

  if (self->document != NULL)
    lamina_document_set_author (self->document, reviewer);
  lamina_window_update_actions (self);
}

static gboolean
refresh_idle_cb (gpointer data)
{
  LaminaWindow *self = data;

  self->refresh_idle = 0;
  lamina_window_refresh_list (self);
  lamina_change_banner_library_changed (self->change_banner, self->external_change);
  self->external_change = FALSE;
  return G_SOURCE_REMOVE;
}

/* Any write, ours or another process's: refresh the rows (U, status) once
 * the burst of writes is over. */
static void
on_library_changed_cb (LaminaWindow *self)
{
  if (self->refresh_idle == 0)
    self->refresh_idle = g_idle_add (refresh_idle_cb, self);
}

void
lamina_window_poll_library (LaminaWindow *self)
{
  /* Another copy of Lamina or the CLI may write to a shared library. */
  if (lamina_library_check_for_changes (self->library))
    self->external_change = TRUE;
}

static gboolean
poll_library_cb (gpointer data)
{
  lamina_window_poll_library (data);
  return G_SOURCE_CONTINUE;
}

static gboolean
lamina_window_close_request (GtkWindow *window)
{
  LaminaWindow *self = LAMINA_WINDOW (window);
  int width, height;

  /* Nothing to ask: every edit is already in the library; a drag in
   * progress is committed here. */
  if (self->document != NULL)
    lamina_document_commit (self->document, NULL);
  /* Writes that wait for another program are not thrown away by a
   * close: the banner's Cancel does that, knowingly. */
  if (lamina_write_gate_is_waiting (self->write_gate))
    {
      lamina_window_notify (self, _("Changes still wait for another program writing this library. "
                                    "Cancel them in the banner to close without them."));
      return TRUE;
    }
  gtk_window_get_default_size (window, &width, &height);
  g_settings_set_int (self->settings, "window-width", width);
  g_settings_set_int (self->settings, "window-height", height);
  g_settings_set_boolean (self->settings, "window-maximized", gtk_window_is_maximized (window));
  g_cancellable_cancel (self->cancellable);

  return GTK_WINDOW_CLASS (lamina_window_parent_class)->close_request (window);
}

static void
lamina_window_dispose (GObject *object)
{
  LaminaWindow *self = LAMINA_WINDOW (object);

  g_clear_handle_id (&self->toast_timeout, g_source_remove);
  g_clear_handle_id (&self->refresh_idle, g_source_remove);
  g_clear_handle_id (&self->poll_timeout, g_source_remove);
  g_clear_handle_id (&self->search_idle, g_source_remove);
  if (self->document != NULL)
    g_signal_handlers_disconnect_by_data (self->document, self);
  g_clear_object (&self->document);
  if (self->cancellable != NULL)
    g_cancellable_cancel (self->cancellable);
  gtk_widget_dispose_template (GTK_WIDGET (self), LAMINA_TYPE_WINDOW);
  g_clear_pointer (&self->held_documents, g_hash_table_unref);
  g_clear_object (&self->selection);
  g_clear_object (&self->list);
  g_clear_object (&self->library);
  g_clear_object (&self->settings);
  g_clear_object (&self->cancellable);

  G_OBJECT_CLASS (lamina_window_parent_class)->dispose (object);
}

static void
lamina_window_finalize (GObject *object)
{
  LaminaWindow *self = LAMINA_WINDOW (object);

  g_clear_pointer (&self->tags, g_ptr_array_unref);
  g_clear_pointer (&self->deleted_id, g_free);
  g_clear_pointer (&self->notice, g_free);

  G_OBJECT_CLASS (lamina_window_parent_class)->finalize (object);
}

static void
lamina_window_class_init (LaminaWindowClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->dispose = lamina_window_dispose;
  object_class->finalize = lamina_window_finalize;
  GTK_WINDOW_CLASS (klass)->close_request = lamina_window_close_request;

  g_type_ensure (LAMINA_TYPE_EDITOR);
  g_type_ensure (LAMINA_TYPE_JOBS_PAGE);
  gtk_widget_class_set_template_from_resource (widget_class, "/org/example/Lamina/lamina-window.ui");
  gtk_widget_class_bind_template_child (widget_class, LaminaWindow, banner_revealer);
  gtk_widget_class_bind_template_child (widget_class, LaminaWindow, banner_label);
  gtk_widget_class_bind_template_child (widget_class, LaminaWindow, paned);
  gtk_widget_class_bind_template_child (widget_class, LaminaWindow, search_entry);
  gtk_widget_class_bind_template_child (widget_class, LaminaWindow, element_filter);
  gtk_widget_class_bind_template_child (widget_class, LaminaWindow, status_filter);
  gtk_widget_class_bind_template_child (widget_class, LaminaWindow, sort_dropdown);
  gtk_widget_class_bind_template_child (widget_class, LaminaWindow, tag_filter);
  gtk_widget_class_bind_template_child (widget_class, LaminaWindow, moisture_filter);
  gtk_widget_class_bind_template_child (widget_class, LaminaWindow, min_u_entry);
  gtk_widget_class_bind_template_child (widget_class, LaminaWindow, max_u_entry);
  gtk_widget_class_bind_template_child (widget_class, LaminaWindow, list_view);
  gtk_widget_class_bind_template_child (widget_class, LaminaWindow, count_label);
  gtk_widget_class_bind_template_child (widget_class, LaminaWindow, filter_chips);
  gtk_widget_class_bind_template_child (widget_class, LaminaWindow, main_stack);
  gtk_widget_class_bind_template_child (widget_class, LaminaWindow, editor);
  gtk_widget_class_bind_template_child (widget_class, LaminaWindow, toast_revealer);
  gtk_widget_class_bind_template_child (widget_class, LaminaWindow, toast_label);
  gtk_widget_class_bind_template_child (widget_class, LaminaWindow, toast_undo);
  gtk_widget_class_bind_template_child (widget_class, LaminaWindow, demo_button);
  gtk_widget_class_bind_template_child (widget_class, LaminaWindow, view_stack);
  gtk_widget_class_bind_template_child (widget_class, LaminaWindow, jobs_page);

  lamina_window_install_actions (widget_class);
}

static void
lamina_window_init (LaminaWindow *self)
{
  gtk_widget_init_template (GTK_WIDGET (self));
  self->cancellable = g_cancellable_new ();
  self->settings = lamina_settings_new ();
}

LaminaWindow *
lamina_window_new (GtkApplication    *application,
                   LaminaLibrary     *library)
{
  LaminaWindow *self;
  GtkListItemFactory *factory;

  g_return_val_if_fail (LAMINA_IS_LIBRARY (library), NULL);

  self = g_object_new (LAMINA_TYPE_WINDOW, "application", application, NULL);
  self->library = g_object_ref (library);
  self->library_total = -1;
  self->list = lamina_construction_list_new (library);
  self->selection = gtk_single_selection_new (g_object_ref (G_LIST_MODEL (self->list)));
  gtk_single_selection_set_autoselect (self->selection, FALSE);
  gtk_single_selection_set_can_unselect (self->selection, TRUE);
  gtk_single_selection_set_selected (self->selection, GTK_INVALID_LIST_POSITION);
  factory = gtk_signal_list_item_factory_new ();
  g_signal_connect_object (factory, "setup", G_CALLBACK (on_row_setup_cb), self, 0);
  g_signal_connect_object (factory, "bind", G_CALLBACK (on_row_bind_cb), self, 0);
  gtk_list_view_set_factory (self->list_view, factory);
  g_object_unref (factory);
  gtk_list_view_set_model (self->list_view, GTK_SELECTION_MODEL (self->selection));
  g_signal_connect_object (self->selection, "notify::selected",
                           G_CALLBACK (on_selection_changed_cb), self, G_CONNECT_SWAPPED);
  g_signal_connect_object (library, "changed", G_CALLBACK (on_library_changed_cb), self, G_CONNECT_SWAPPED);
  g_signal_connect_object (self->list, "items-changed", G_CALLBACK (on_list_items_changed_cb), self, G_CONNECT_SWAPPED);
  {
    GtkGesture *click = gtk_gesture_click_new ();

    g_signal_connect_object (click, "pressed", G_CALLBACK (on_count_pressed_cb), self, G_CONNECT_SWAPPED);
    gtk_widget_add_controller (GTK_WIDGET (self->count_label), GTK_EVENT_CONTROLLER (click));
  }

  self->change_banner = LAMINA_CHANGE_BANNER (lamina_change_banner_new ());
  gtk_widget_insert_after (GTK_WIDGET (self->change_banner),
                           gtk_widget_get_parent (GTK_WIDGET (self->banner_revealer)),
                           GTK_WIDGET (self->banner_revealer));
  {
    GtkWidget *safety_bar = lamina_safety_bar_new (library);

    gtk_widget_insert_after (safety_bar, gtk_widget_get_parent (GTK_WIDGET (self->banner_revealer)),
                             GTK_WIDGET (self->change_banner));
    self->write_gate = LAMINA_WRITE_GATE (lamina_write_gate_new (library));
    gtk_widget_insert_after (GTK_WIDGET (self->write_gate),
                             gtk_widget_get_parent (GTK_WIDGET (self->banner_revealer)), safety_bar);
  }
  setup_filters (self);
  update_count (self);
  lamina_jobs_page_set_library (self->jobs_page, library);
  self->poll_timeout = g_timeout_add_seconds (3, poll_library_cb, self);

  gtk_window_set_default_size (GTK_WINDOW (self),
                               g_settings_get_int (self->settings, "window-width"),
                               g_settings_get_int (self->settings, "window-height"));
  if (g_settings_get_boolean (self->settings, "window-maximized"))
    gtk_window_maximize (GTK_WINDOW (self));
  g_signal_connect_object (self->settings, "changed::snap-step", G_CALLBACK (on_snap_step_changed_cb), self, G_CONNECT_SWAPPED);
  g_signal_connect_object (self->settings, "changed::reviewer-name", G_CALLBACK (on_reviewer_changed_cb), self, G_CONNECT_SWAPPED);
  on_snap_step_changed_cb (self);
  g_settings_bind (self->settings, "show-temperatures", self->editor, "show-temperatures", G_SETTINGS_BIND_DEFAULT);

  set_document (self, NULL);
  return self;
}

LaminaConstructionList *
lamina_window_get_list (LaminaWindow *self)
{
  g_return_val_if_fail (LAMINA_IS_WINDOW (self), NULL);
  return self->list;
}

LaminaLibrary *
lamina_window_get_library (LaminaWindow *self)
{
  g_return_val_if_fail (LAMINA_IS_WINDOW (self), NULL);
  return self->library;
}

LaminaEditor *
lamina_window_get_editor (LaminaWindow *self)
{
  g_return_val_if_fail (LAMINA_IS_WINDOW (self), NULL);
  return self->editor;
}

LaminaJobsPage *
lamina_window_get_jobs_page (LaminaWindow *self)
{
  g_return_val_if_fail (LAMINA_IS_WINDOW (self), NULL);
  return self->jobs_page;
}

void
lamina_window_show_view (LaminaWindow *self,
                         const char   *name)
{
  g_return_if_fail (LAMINA_IS_WINDOW (self));
  gtk_stack_set_visible_child_name (self->view_stack, name);
}
