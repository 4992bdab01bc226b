/* SPDX-License-Identifier: GPL-3.0-or-later */
/* LaminaReviewDialog: the confirmation before an act that the office
 * relies on — approving a revision, withdrawing an approval, deleting an
 * approved construction.  It names the construction and the revision,
 * says under which review policy the act is made, asks for a reason where
 * one is needed, and shows the library's refusal (four eyes, a revision
 * that moved on) without closing. */
#define G_LOG_DOMAIN "lamina-app"

#include "config.h"

#include "lamina-review-dialog-private.h"

#include <glib/gi18n.h>

G_DEFINE_FINAL_TYPE (LaminaReviewDialog, lamina_review_dialog, GTK_TYPE_WINDOW)

static void
lamina_review_dialog_finalize (GObject *object)
{
  LaminaReviewDialog *self = LAMINA_REVIEW_DIALOG (object);

  g_clear_object (&self->library);
  g_clear_pointer (&self->id, g_free);
  g_clear_pointer (&self->reviewer, g_free);
  G_OBJECT_CLASS (lamina_review_dialog_parent_class)->finalize (object);
}

static void
lamina_review_dialog_class_init (LaminaReviewDialogClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->finalize = lamina_review_dialog_finalize;
  gtk_widget_class_set_template_from_resource (widget_class, "/org/example/Lamina/lamina-review-dialog.ui");
  gtk_widget_class_bind_template_child (widget_class, LaminaReviewDialog, heading);
  gtk_widget_class_bind_template_child (widget_class, LaminaReviewDialog, body);
  gtk_widget_class_bind_template_child (widget_class, LaminaReviewDialog, reason_label);
  gtk_widget_class_bind_template_child (widget_class, LaminaReviewDialog, reason);
  gtk_widget_class_bind_template_child (widget_class, LaminaReviewDialog, error);
  gtk_widget_class_bind_template_child (widget_class, LaminaReviewDialog, cancel);
  gtk_widget_class_bind_template_child (widget_class, LaminaReviewDialog, accept);
  gtk_widget_class_bind_template_callback (widget_class, gtk_window_destroy);
  gtk_widget_class_bind_template_callback (widget_class, lamina_review_dialog_accept);
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_Escape, 0, "window.close", NULL);
}

static void
lamina_review_dialog_init (LaminaReviewDialog *self)
{
  gtk_widget_init_template (GTK_WIDGET (self));
}

static void
show_error (LaminaReviewDialog *self,
            const char         *message)
{
  gtk_label_set_text (self->error, message);
  gtk_widget_set_visible (GTK_WIDGET (self->error), TRUE);
}

static void
ask_reason (LaminaReviewDialog *self,
            const char         *label,
            gboolean            required)
{
  gtk_label_set_text_with_mnemonic (self->reason_label, label);
  gtk_widget_set_visible (GTK_WIDGET (self->reason_label), TRUE);
  gtk_widget_set_visible (GTK_WIDGET (self->reason), TRUE);
  self->reason_required = required;
}

/* The words of the dialog for @c, revision @self->revision. */
static void
fill (LaminaReviewDialog       *self,
      const LaminaConstruction *c)
{
  const char *code = c->code ? c->code : c->name;
  LaminaReviewPolicy policy = lamina_library_get_review_policy (self->library);
  g_autofree char *heading = NULL, *body = NULL;

  switch (self->kind)
    {
    case LAMINA_REVIEW_DIALOG_APPROVE:
      {
        g_autoptr(LaminaResult) result = lamina_calculate (c, NULL);
        gboolean outside = result != NULL && lamina_field_is_advised (result)
                           && !lamina_library_has_field_check (self->library, self->id, self->revision);

        /* TRANSLATORS: "Approve EW-101 revision 4 “Timber frame wall”?" */
        heading = g_strdup_printf (_("Approve %s revision %d “%s”?"), code, self->revision, c->name);
        /* TRANSLATORS: the first %s is the reviewer, the second the policy described */
        body = g_strdup_printf (_("You approve it as %s under the library’s review policy: %s. "
                                  "The approval is recorded with today’s date and the revision "
                                  "cannot change afterwards; check that it meets the project’s "
                                  "targets and local regulations."),
                                self->reviewer, lamina_review_policy_describe (policy));
        if (outside)
          ask_reason (self, _("This result is outside the scope of EN ISO 6946 (metal bridging "
                              "insulation or R′T/R″T above 1.5) and has no 2-D check (EN ISO "
                              "10211). _Reason for approving it on this result:"), TRUE);
        gtk_button_set_label (self->accept, _("_Approve"));
        gtk_widget_add_css_class (GTK_WIDGET (self->accept), "suggested-action");
        gtk_window_set_title (GTK_WINDOW (self), _("Approve Revision"));
        break;
      }
    case LAMINA_REVIEW_DIALOG_WITHDRAW:
      heading = g_strdup_printf (_("Withdraw the approval of %s revision %d “%s”?"), code,
                                 self->revision, c->name);
      body = g_strdup_printf (_("Approved by %s. The revision goes back to checked; sheets "
                                "already issued from it no longer stand for an approved "
                                "build-up. The reason is recorded in the history."),
                              c->approved_by ? c->approved_by : "—");
      ask_reason (self, _("_Reason for withdrawing:"), TRUE);
      gtk_button_set_label (self->accept, _("_Withdraw Approval"));
      gtk_widget_add_css_class (GTK_WIDGET (self->accept), "destructive-action");
      gtk_window_set_title (GTK_WINDOW (self), _("Withdraw Approval"));
      break;
    case LAMINA_REVIEW_DIALOG_DELETE:
    default:
      heading = g_strdup_printf (_("Delete %s “%s”?"), code, c->name);
      body = g_strdup_printf (_("Revision %d is approved (by %s): sheets and jobs may rely on it. "
                                "Deleting hides it from the library and from new jobs; its "
                                "history is kept, and Undo brings it back."),
                              self->revision, c->approved_by ? c->approved_by : "—");
      gtk_button_set_label (self->accept, _("_Delete"));
      gtk_widget_add_css_class (GTK_WIDGET (self->accept), "destructive-action");
      gtk_window_set_title (GTK_WINDOW (self), _("Delete Approved Construction"));
      break;
    }
  gtk_label_set_text (self->heading, heading);
  gtk_label_set_text (self->body, body);
}

gboolean
lamina_review_dialog_accept (LaminaReviewDialog *self)
{
  g_autoptr(GError) error = NULL;
  g_autofree char *message = NULL;
  g_autofree char *reason = NULL;
  gboolean ok = TRUE;

  g_return_val_if_fail (LAMINA_IS_REVIEW_DIALOG (self), FALSE);
  reason = g_strstrip (g_strdup (gtk_editable_get_text (GTK_EDITABLE (self->reason))));
  if (self->reason_required && *reason == '\0')
    {
      show_error (self, _("Give the reason: it is recorded with the act"));
      gtk_widget_grab_focus (GTK_WIDGET (self->reason));
      return FALSE;
    }
  switch (self->kind)
    {
    case LAMINA_REVIEW_DIALOG_APPROVE:
      ok = lamina_library_approve_with_reason (self->library, self->id, self->revision, self->reviewer,
                                               NULL, *reason ? reason : NULL, &error);
      /* TRANSLATORS: the last %s is "four-eyes" or "single" */
      message = g_strdup_printf (_("Revision %d approved by %s (review policy: %s)"), self->revision,
                                 self->reviewer,
                                 lamina_review_policy_to_string (lamina_library_get_review_policy (self->library)));
      break;
    case LAMINA_REVIEW_DIALOG_WITHDRAW:
      ok = lamina_library_withdraw_approval (self->library, self->id, self->revision, self->reviewer,
                                             reason, &error);
      message = g_strdup_printf (_("Approval of revision %d withdrawn by %s: %s"), self->revision,
                                 self->reviewer, reason);
      break;
    case LAMINA_REVIEW_DIALOG_DELETE:
    default:
      break;
    }
  if (!ok)
    {
      /* The library's refusal, as it said it: four eyes, a revision that
       * moved on, a date.  Nothing was recorded. */
      show_error (self, error->message);
      return FALSE;
    }
  if (self->done != NULL)
    self->done (self->parent, message);
  gtk_window_destroy (GTK_WINDOW (self));
  return TRUE;
}

LaminaReviewDialog *
lamina_review_dialog_present (GtkWindow              *parent,
                              LaminaLibrary          *library,
                              const char             *id,
                              int                     revision,
                              LaminaReviewDialogKind  kind,
                              const char             *reviewer,
                              LaminaReviewDialogDone  done)
{
  g_autoptr(GError) error = NULL;
  g_autoptr(LaminaConstruction) c = NULL;
  LaminaReviewDialog *self;

  g_return_val_if_fail (LAMINA_IS_LIBRARY (library), NULL);
  g_return_val_if_fail (id != NULL, NULL);

  self = g_object_new (LAMINA_TYPE_REVIEW_DIALOG, "transient-for", parent, NULL);
  self->library = g_object_ref (library);
  self->id = g_strdup (id);
  self->revision = revision;
  self->kind = kind;
  self->reviewer = g_strdup (reviewer ? reviewer : "");
  self->done = done;
  self->parent = parent;
  c = lamina_library_dup_construction (library, id, revision, &error);
  if (c == NULL)
    {
      gtk_label_set_text (self->heading, _("This revision cannot be read"));
      show_error (self, error->message);
      gtk_widget_set_sensitive (GTK_WIDGET (self->accept), FALSE);
    }
  else
    fill (self, c);
  gtk_window_present (GTK_WINDOW (self));
  gtk_widget_grab_focus (GTK_WIDGET (self->cancel));
  return self;
}
