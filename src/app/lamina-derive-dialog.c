/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-derive-dialog.c: what the copy for a new job keeps.  The old
 * job's description and notes are about the old job and are left behind
 * unless asked for; tags (the build-up's kind, its materials, a project)
 * are each a choice, kept by default. */
#define G_LOG_DOMAIN "lamina-app"

#include "config.h"

#include "lamina-derive-dialog-private.h"

#include <glib/gi18n.h>

G_DEFINE_FINAL_TYPE (LaminaDeriveDialog, lamina_derive_dialog, GTK_TYPE_WINDOW)

static void
on_derive_clicked_cb (LaminaDeriveDialog *self)
{
  g_autoptr(GPtrArray) keep = g_ptr_array_new ();
  g_autoptr(GError) error = NULL;
  g_autofree char *id = NULL;

  for (guint i = 0; i < self->tag_checks->len; i++)
    if (gtk_check_button_get_active (self->tag_checks->pdata[i]))
      g_ptr_array_add (keep, self->tags->pdata[i]);
  g_ptr_array_add (keep, NULL);
  id = lamina_library_derive_for_job (self->library, self->id,
                                      gtk_check_button_get_active (self->description),
                                      gtk_check_button_get_active (self->notes),
                                      (const char * const *) keep->pdata, self->author, &error);
  self->done (self->parent, id, error);
  gtk_window_destroy (GTK_WINDOW (self));
}

static void
on_cancel_clicked_cb (LaminaDeriveDialog *self)
{
  gtk_window_destroy (GTK_WINDOW (self));
}

/* A choice that says what it keeps: its text as the tooltip, and
 * insensitive when there is nothing to keep. */
static void
show_choice (GtkCheckButton *check,
             const char     *text)
{
  gboolean some = text != NULL && *text != '\0';

  gtk_widget_set_tooltip_text (GTK_WIDGET (check), some ? text : NULL);
  gtk_widget_set_sensitive (GTK_WIDGET (check), some);
}

static void
show_construction (LaminaDeriveDialog       *self,
                   const LaminaConstruction *c)
{
  g_autofree char *intro = g_strdup_printf (_("A new draft from %s, without its code, for a new job. Keep:"),
                                            c->code ? c->code : c->name);

  gtk_label_set_text (self->intro, intro);
  show_choice (self->description, c->description);
  show_choice (self->notes, c->notes);
  for (guint i = 0; i < c->tags->len; i++)
    {
      GtkWidget *check = gtk_check_button_new_with_label (c->tags->pdata[i]);

      gtk_check_button_set_active (GTK_CHECK_BUTTON (check), TRUE);
      gtk_flow_box_append (self->tag_box, check);
      g_ptr_array_add (self->tags, g_strdup (c->tags->pdata[i]));
      g_ptr_array_add (self->tag_checks, check);
    }
  gtk_widget_set_visible (GTK_WIDGET (self->tags_heading), c->tags->len > 0);
  gtk_widget_set_visible (GTK_WIDGET (self->tag_box), c->tags->len > 0);
}

LaminaDeriveDialog *
lamina_derive_dialog_present (GtkWindow                *parent,
                              LaminaLibrary            *library,
                              const LaminaConstruction *c,
                              const char               *author,
                              LaminaDeriveDone          done)
{
  LaminaDeriveDialog *self;

  g_return_val_if_fail (GTK_IS_WINDOW (parent), NULL);
  g_return_val_if_fail (LAMINA_IS_LIBRARY (library), NULL);
  g_return_val_if_fail (c != NULL && done != NULL, NULL);

  self = g_object_new (LAMINA_TYPE_DERIVE_DIALOG, "transient-for", parent, NULL);
  self->parent = g_object_ref (parent);
  self->library = g_object_ref (library);
  self->id = g_strdup (c->id);
  self->author = g_strdup (author);
  self->done = done;
  show_construction (self, c);
  gtk_window_present (GTK_WINDOW (self));
  return self;
}

static void
lamina_derive_dialog_dispose (GObject *object)
{
  LaminaDeriveDialog *self = LAMINA_DERIVE_DIALOG (object);

  g_clear_object (&self->parent);
  g_clear_object (&self->library);
  G_OBJECT_CLASS (lamina_derive_dialog_parent_class)->dispose (object);
}

static void
lamina_derive_dialog_finalize (GObject *object)
{
  LaminaDeriveDialog *self = LAMINA_DERIVE_DIALOG (object);

  g_free (self->id);
  g_free (self->author);
  g_ptr_array_unref (self->tags);
  g_ptr_array_unref (self->tag_checks);
  G_OBJECT_CLASS (lamina_derive_dialog_parent_class)->finalize (object);
}

static void
lamina_derive_dialog_class_init (LaminaDeriveDialogClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->dispose = lamina_derive_dialog_dispose;
  object_class->finalize = lamina_derive_dialog_finalize;

  gtk_widget_class_set_template_from_resource (widget_class, "/org/example/Lamina/lamina-derive-dialog.ui");
  gtk_widget_class_bind_template_child (widget_class, LaminaDeriveDialog, intro);
  gtk_widget_class_bind_template_child (widget_class, LaminaDeriveDialog, description);
  gtk_widget_class_bind_template_child (widget_class, LaminaDeriveDialog, notes);
  gtk_widget_class_bind_template_child (widget_class, LaminaDeriveDialog, tags_heading);
  gtk_widget_class_bind_template_child (widget_class, LaminaDeriveDialog, tag_box);
  gtk_widget_class_bind_template_child (widget_class, LaminaDeriveDialog, derive_button);
  gtk_widget_class_bind_template_callback (widget_class, on_derive_clicked_cb);
  gtk_widget_class_bind_template_callback (widget_class, on_cancel_clicked_cb);
}

static void
lamina_derive_dialog_init (LaminaDeriveDialog *self)
{
  self->tags = g_ptr_array_new_with_free_func (g_free);
  self->tag_checks = g_ptr_array_new ();
  gtk_widget_init_template (GTK_WIDGET (self));
}
