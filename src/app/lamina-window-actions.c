/* SPDX-License-Identifier: GPL-3.0-or-later */
/* The window's actions: undo/redo, review, derive/delete, conflicts. */
#define G_LOG_DOMAIN "lamina-app"

#include "config.h"

#include "lamina-library-safety.h"

#include <glib/gi18n.h>
#include <math.h>

#include "lamina-derive-dialog.h"
#include "lamina-demo.h"
#include "lamina-history-window.h"
#include "lamina-materials-window.h"
#include "lamina-review-dialog.h"
#include "lamina-climates-window.h"
#include "lamina-window-private.h"

static char *
dup_reviewer (LaminaWindow *self)
{
  g_autofree char *name = g_settings_get_string (self->settings, "reviewer-name");

  return *g_strstrip (name) ? g_steal_pointer (&name) : NULL;
}

void
lamina_window_update_actions (LaminaWindow *self)
{
  LaminaDocument *doc = self->document;
  const LaminaConstruction *state = doc ? lamina_document_get_construction (doc) : NULL;
  g_autofree char *reviewer = dup_reviewer (self);
  gboolean open = state != NULL;
  gboolean conflict = doc && lamina_document_get_conflict (doc) != NULL;
  /* A read-only library is for browsing, sheets and exports only. */
  gboolean writable = !lamina_library_is_read_only (self->library);

  gtk_widget_action_set_enabled (GTK_WIDGET (self), "win.undo", writable && open && lamina_document_can_undo (doc));
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "win.redo", writable && open && lamina_document_can_redo (doc));
  /* A checked revision can be checked again by another person (a record
   * of its own); only a checked revision can be approved. */
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "win.mark-checked",
                                 writable && open && !conflict
                                 && state->status != LAMINA_STATUS_APPROVED);
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "win.approve",
                                 writable && open && !conflict
                                 && state->status == LAMINA_STATUS_CHECKED);
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "win.withdraw",
                                 writable && open && !conflict
                                 && state->status == LAMINA_STATUS_APPROVED);
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "win.history", open);
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "win.used-in-jobs", open);
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "win.update-materials", writable && open);
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "win.derive", writable && open);
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "win.delete", writable && open);
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "win.export-sheet", open);
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "win.export-section", open);
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "win.print", open);
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "win.undo-delete",
                                 writable && self->deleted_id != NULL);
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "win.new-construction", writable);
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "win.import-xml", writable);
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "win.load-demo", writable);
  gtk_widget_set_visible (self->demo_button,
                          writable && self->list != NULL && g_list_model_get_n_items (G_LIST_MODEL (self->list)) == 0);
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "win.conflict-keep", conflict);
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "win.conflict-reload", conflict);
}

static void
undo_action (GtkWidget  *widget,
             const char *name,
             GVariant   *parameter)
{
  LaminaWindow *self = LAMINA_WINDOW (widget);

  if (self->document == NULL)
    return;
  if (g_str_equal (name, "win.undo"))
    lamina_document_undo (self->document);
  else
    lamina_document_redo (self->document);
  lamina_window_refresh_list (self);
}

static void
after_review (LaminaWindow *self,
              gboolean      ok,
              GError       *error,
              const char   *message)
{
  g_autoptr(GError) reload_error = NULL;

  if (!ok)
    {
      lamina_window_notify (self, error->message);
      return;
    }
  lamina_document_reload (self->document, &reload_error);
  lamina_window_refresh_list (self);
  lamina_window_notify (self, reload_error ? reload_error->message : message);
}

/* After the review dialog recorded an approval or a withdrawal. */
static void
on_review_done_cb (GtkWindow  *parent,
                   const char *message)
{
  LaminaWindow *self = LAMINA_WINDOW (parent);

  if (self->document != NULL)
    after_review (self, TRUE, NULL, message);
}

static void
review_action (GtkWidget  *widget,
               const char *name,
               GVariant   *parameter)
{
  LaminaWindow *self = LAMINA_WINDOW (widget);
  g_autofree char *reviewer = dup_reviewer (self);
  const char *id;
  int revision;

  if (self->document == NULL)
    return;
  if (reviewer == NULL)
    {
      lamina_window_notify (self, _("Set your reviewer name in Preferences first: a review records who made it"));
      gtk_widget_activate_action (widget, "app.preferences", NULL);
      return;
    }
  lamina_document_commit (self->document, NULL);
  if (!lamina_window_check_no_waiting_writes (self))
    return;
  id = lamina_document_get_id (self->document);
  revision = lamina_document_get_base_revision (self->document);
  if (g_str_equal (name, "win.approve") || g_str_equal (name, "win.withdraw"))
    {
      /* Asked first, naming the revision; the dialog applies the policy
       * and shows a refusal. */
      lamina_review_dialog_present (GTK_WINDOW (self), self->library, id, revision,
                                    g_str_equal (name, "win.approve")
                                    ? LAMINA_REVIEW_DIALOG_APPROVE : LAMINA_REVIEW_DIALOG_WITHDRAW,
                                    reviewer, on_review_done_cb);
      return;
    }
  lamina_window_check_revision (self, id, revision, reviewer);
}

static void
update_materials_action (GtkWidget  *widget,
                         const char *name,
                         GVariant   *parameter)
{
  LaminaWindow *self = LAMINA_WINDOW (widget);
  g_autoptr(GPtrArray) changes = NULL;
  g_autoptr(GError) error = NULL;
  g_autofree char *reviewer = dup_reviewer (self);
  g_autofree char *message = NULL;
  const char *id;
  int revision;

  if (self->document == NULL)
    return;
  lamina_document_commit (self->document, NULL);
  id = lamina_document_get_id (self->document);
  changes = lamina_library_list_material_changes (self->library, id, &error);
  if (changes == NULL)
    {
      lamina_window_notify (self, error->message);
      return;
    }
  if (changes->len == 0)
    {
      lamina_window_notify (self, _("The layers already hold the library’s current material data"));
      return;
    }
  revision = lamina_library_update_materials (self->library, id,
                                              lamina_document_get_base_revision (self->document),
                                              reviewer, &error);
  if (revision == 0)
    {
      lamina_window_notify (self, error->message);
      return;
    }
  message = g_strdup_printf (g_dngettext (NULL, "%u material updated: draft revision %d, check it again",
                                          "%u materials updated: draft revision %d, check it again",
                                          changes->len),
                             changes->len, revision);
  after_review (self, TRUE, NULL, message);
}

static void
new_construction_action (GtkWidget  *widget,
                         const char *name,
                         GVariant   *parameter)
{
  LaminaWindow *self = LAMINA_WINDOW (widget);
  g_autoptr(LaminaConstruction) construction = NULL;
  g_autoptr(GPtrArray) materials = NULL;
  g_autoptr(GError) error = NULL;
  g_autofree char *reviewer = dup_reviewer (self);
  g_autofree char *id = NULL;

  construction = lamina_construction_new (NULL, _("New wall"), LAMINA_ELEMENT_WALL);
  construction->heat_flow = lamina_element_default_heat_flow (LAMINA_ELEMENT_WALL);
  construction->inside_temperature = g_settings_get_double (self->settings, "inside-temperature");
  construction->outside_temperature = g_settings_get_double (self->settings, "outside-temperature");
  materials = lamina_library_list_materials (self->library, NULL);
  /* A start the user reshapes: the first insulation of the library. */
  for (guint i = 0; materials != NULL && i < materials->len; i++)
    {
      const LaminaMaterial *material = g_ptr_array_index (materials, i);

      if (material->category == LAMINA_CATEGORY_INSULATION)
        {
          lamina_construction_add_layer (construction,
                                         lamina_layer_new_material (100, lamina_material_copy (material)));
          break;
        }
    }
  if (construction->layers->len == 0 && materials != NULL && materials->len > 0)
    lamina_construction_add_layer (construction,
                                   lamina_layer_new_material (100, lamina_material_copy (materials->pdata[0])));
  id = lamina_library_create_construction (self->library, construction, reviewer, &error);
  if (id == NULL)
    {
      lamina_window_notify (self, error->message);
      return;
    }
  lamina_window_refresh_list (self);
  if (!lamina_window_open (self, id, &error))
    lamina_window_notify (self, error->message);
}

static void
on_derived_cb (GtkWindow  *parent,
               const char *id,
               GError     *error)
{
  LaminaWindow *self = LAMINA_WINDOW (parent);
  g_autoptr(GError) open_error = NULL;

  if (id == NULL || !lamina_window_open (self, id, &open_error))
    {
      lamina_window_notify (self, error ? error->message : open_error->message);
      return;
    }
  lamina_window_refresh_list (self);
  lamina_window_notify (self, _("Derived a new draft: give it a code and a name for the new job"));
}

static void
derive_action (GtkWidget  *widget,
               const char *name,
               GVariant   *parameter)
{
  LaminaWindow *self = LAMINA_WINDOW (widget);
  g_autoptr(GError) error = NULL;
  g_autofree char *reviewer = dup_reviewer (self);

  if (self->document == NULL)
    return;
  lamina_document_commit (self->document, NULL);
  lamina_derive_dialog_present (GTK_WINDOW (self), self->library, lamina_document_get_construction (self->document),
                                reviewer, on_derived_cb);
}

static void
delete_open_construction (LaminaWindow *self)
{
  g_autoptr(GError) error = NULL;
  g_autofree char *reviewer = dup_reviewer (self);
  g_autofree char *id = NULL;
  g_autofree char *message = NULL;

  if (self->document == NULL)
    return;
  id = g_strdup (lamina_document_get_id (self->document));
  message = g_strdup_printf (_("“%s” deleted"), lamina_document_get_construction (self->document)->name);
  lamina_window_delete_construction (self, id, reviewer, message);
}

static void
on_delete_confirmed_cb (GtkWindow  *parent,
                        const char *message)
{
  delete_open_construction (LAMINA_WINDOW (parent));
}

/* Deleting an approved construction asks first (sheets and jobs may rely
 * on it); anything else is deleted at once, with Undo in the message. */
static void
delete_action (GtkWidget  *widget,
               const char *name,
               GVariant   *parameter)
{
  LaminaWindow *self = LAMINA_WINDOW (widget);
  const LaminaConstruction *state;
  g_autofree char *reviewer = dup_reviewer (self);

  if (self->document == NULL)
    return;
  lamina_document_commit (self->document, NULL);
  state = lamina_document_get_construction (self->document);
  if (state->status == LAMINA_STATUS_APPROVED)
    {
      lamina_review_dialog_present (GTK_WINDOW (self), self->library, lamina_document_get_id (self->document),
                                    state->revision, LAMINA_REVIEW_DIALOG_DELETE, reviewer,
                                    on_delete_confirmed_cb);
      return;
    }
  delete_open_construction (self);
}

static void
undo_delete_action (GtkWidget  *widget,
                    const char *name,
                    GVariant   *parameter)
{
  LaminaWindow *self = LAMINA_WINDOW (widget);
  g_autoptr(GError) error = NULL;
  g_autofree char *id = g_steal_pointer (&self->deleted_id);

  if (id == NULL)
    return;
  gtk_revealer_set_reveal_child (self->toast_revealer, FALSE);
  lamina_window_restore_construction (self, id);
  lamina_window_update_actions (self);
}

static void
dismiss_action (GtkWidget  *widget,
                const char *name,
                GVariant   *parameter)
{
  LaminaWindow *self = LAMINA_WINDOW (widget);

  gtk_revealer_set_reveal_child (self->toast_revealer, FALSE);
  g_clear_pointer (&self->deleted_id, g_free);
  lamina_window_update_actions (self);
}

static void
conflict_action (GtkWidget  *widget,
                 const char *name,
                 GVariant   *parameter)
{
  LaminaWindow *self = LAMINA_WINDOW (widget);
  g_autoptr(GError) error = NULL;
  gboolean ok;

  if (self->document == NULL)
    return;
  if (g_str_equal (name, "win.conflict-keep"))
    ok = lamina_document_keep_mine (self->document, &error);
  else
    ok = lamina_document_reload (self->document, &error);
  if (!ok)
    lamina_window_notify (self, error->message);
  lamina_window_refresh_list (self);
}

static void
history_action (GtkWidget  *widget,
                const char *name,
                GVariant   *parameter)
{
  LaminaWindow *self = LAMINA_WINDOW (widget);

  if (self->document == NULL)
    return;
  lamina_document_commit (self->document, NULL);
  lamina_history_window_present (GTK_WINDOW (self), self->library,
                                 lamina_document_get_id (self->document));
}

/* The library shows which jobs use the open construction. */
static void
used_in_jobs_action (GtkWidget  *widget,
                     const char *name,
                     GVariant   *parameter)
{
  LaminaWindow *self = LAMINA_WINDOW (widget);
  g_autofree char *text = NULL;

  if (self->document == NULL)
    return;
  text = lamina_jobs_page_dup_uses_text (self->jobs_page, lamina_document_get_id (self->document));
  lamina_window_notify (self, text);
}

static void
materials_action (GtkWidget  *widget,
                  const char *name,
                  GVariant   *parameter)
{
  LaminaWindow *self = LAMINA_WINDOW (widget);

  lamina_materials_window_present (GTK_WINDOW (self), self->library);
}

static void
climates_action (GtkWidget  *widget,
                 const char *name,
                 GVariant   *parameter)
{
  LaminaWindow *self = LAMINA_WINDOW (widget);

  lamina_climates_window_present (GTK_WINDOW (self), self->library);
}

static void
load_demo_action (GtkWidget  *widget,
                  const char *name,
                  GVariant   *parameter)
{
  LaminaWindow *self = LAMINA_WINDOW (widget);
  g_autoptr(GError) error = NULL;

  if (!lamina_demo_load (self->library, &error))
    {
      lamina_window_notify (self, error->message);
      return;
    }
  lamina_window_refresh_list (self);
  lamina_window_notify (self, _("Demo build-ups loaded: an invented practice, not design values for real work"));
}

static void
search_action (GtkWidget  *widget,
               const char *name,
               GVariant   *parameter)
{
  LaminaWindow *self = LAMINA_WINDOW (widget);

  gtk_widget_grab_focus (GTK_WIDGET (self->search_entry));
}

void
lamina_window_install_actions (GtkWidgetClass *widget_class)
{
  gtk_widget_class_install_action (widget_class, "win.undo", NULL, undo_action);
  gtk_widget_class_install_action (widget_class, "win.redo", NULL, undo_action);
  gtk_widget_class_install_action (widget_class, "win.mark-checked", NULL, review_action);
  gtk_widget_class_install_action (widget_class, "win.approve", NULL, review_action);
  gtk_widget_class_install_action (widget_class, "win.withdraw", NULL, review_action);
  gtk_widget_class_install_action (widget_class, "win.update-materials", NULL, update_materials_action);
  gtk_widget_class_install_action (widget_class, "win.history", NULL, history_action);
  gtk_widget_class_install_action (widget_class, "win.used-in-jobs", NULL, used_in_jobs_action);
  gtk_widget_class_install_action (widget_class, "win.new-construction", NULL, new_construction_action);
  gtk_widget_class_install_action (widget_class, "win.derive", NULL, derive_action);
  gtk_widget_class_install_action (widget_class, "win.delete", NULL, delete_action);
  gtk_widget_class_install_action (widget_class, "win.undo-delete", NULL, undo_delete_action);
  gtk_widget_class_install_action (widget_class, "win.dismiss-notice", NULL, dismiss_action);
  gtk_widget_class_install_action (widget_class, "win.conflict-keep", NULL, conflict_action);
  gtk_widget_class_install_action (widget_class, "win.conflict-reload", NULL, conflict_action);
  gtk_widget_class_install_action (widget_class, "win.materials", NULL, materials_action);
  gtk_widget_class_install_action (widget_class, "win.climates", NULL, climates_action);
  gtk_widget_class_install_action (widget_class, "win.search", NULL, search_action);
  gtk_widget_class_install_action (widget_class, "win.load-demo", NULL, load_demo_action);
  lamina_window_install_export_actions (widget_class);
  lamina_window_install_design_actions (widget_class);

  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_z, GDK_CONTROL_MASK, "win.undo", NULL);
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_z, GDK_CONTROL_MASK | GDK_SHIFT_MASK, "win.redo", NULL);
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_y, GDK_CONTROL_MASK, "win.redo", NULL);
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_f, GDK_CONTROL_MASK, "win.search", NULL);
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_n, GDK_CONTROL_MASK, "win.new-construction", NULL);
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_e, GDK_CONTROL_MASK, "win.export-sheet", NULL);
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_p, GDK_CONTROL_MASK, "win.print", NULL);
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_h, GDK_CONTROL_MASK, "win.history", NULL);
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_m, GDK_CONTROL_MASK, "win.materials", NULL);
}
