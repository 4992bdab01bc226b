/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-derive-dialog.c: what the copy for a new job keeps.  The old
 * job's description and notes are about the old job and are left behind
 * unless asked for; tags (the build-up's kind, its materials, a project)
 * are each a choice, kept by default. */
#define G_LOG_DOMAIN "lamina-app"

#include "config.h"

#include "lamina-derive-dialog.h"

#include <glib/gi18n.h>

typedef struct
{
  GtkWindow        *window;       /* borrowed: owns this struct */
  GtkWindow        *parent;       /* owned */
  LaminaLibrary    *library;      /* owned */
  char             *id;
  char             *author;
  LaminaDeriveDone  done;
  GtkCheckButton   *description;
  GtkCheckButton   *notes;
  GPtrArray        *tags;         /* GtkCheckButton*, borrowed; tag name as data */
} DeriveDialog;

static void
derive_dialog_free (DeriveDialog *d)
{
  g_clear_object (&d->parent);
  g_clear_object (&d->library);
  g_free (d->id);
  g_free (d->author);
  g_ptr_array_unref (d->tags);
  g_free (d);
}

static DeriveDialog *
get_dialog (GtkWindow *window)
{
  return g_object_get_data (G_OBJECT (window), "lamina-derive-dialog");
}

void
lamina_derive_dialog_accept (GtkWindow *window)
{
  DeriveDialog *d = get_dialog (window);
  g_autoptr(GPtrArray) keep = g_ptr_array_new ();
  g_autoptr(GError) error = NULL;
  g_autofree char *id = NULL;

  g_return_if_fail (d != NULL);
  for (guint i = 0; i < d->tags->len; i++)
    if (gtk_check_button_get_active (d->tags->pdata[i]))
      g_ptr_array_add (keep, g_object_get_data (d->tags->pdata[i], "lamina-tag"));
  g_ptr_array_add (keep, NULL);
  id = lamina_library_derive_for_job (d->library, d->id,
                                      gtk_check_button_get_active (d->description),
                                      gtk_check_button_get_active (d->notes),
                                      (const char * const *) keep->pdata, d->author, &error);
  d->done (d->parent, id, error);
  gtk_window_destroy (window);
}

GtkCheckButton *
lamina_derive_dialog_get_check (GtkWindow  *window,
                                const char *what)
{
  DeriveDialog *d = get_dialog (window);

  g_return_val_if_fail (d != NULL, NULL);
  if (g_str_equal (what, "description"))
    return d->description;
  if (g_str_equal (what, "notes"))
    return d->notes;
  for (guint i = 0; i < d->tags->len; i++)
    if (g_strcmp0 (g_object_get_data (d->tags->pdata[i], "lamina-tag"), what) == 0)
      return d->tags->pdata[i];
  return NULL;
}

static GtkCheckButton *
add_check (GtkWidget  *box,
           const char *label,
           const char *detail,
           gboolean    active)
{
  GtkWidget *check = gtk_check_button_new_with_mnemonic (label);

  gtk_check_button_set_active (GTK_CHECK_BUTTON (check), active);
  if (detail != NULL && *detail != '\0')
    gtk_widget_set_tooltip_text (check, detail);
  gtk_box_append (GTK_BOX (box), check);
  return GTK_CHECK_BUTTON (check);
}

static GtkWidget *
add_heading (GtkWidget  *box,
             const char *text)
{
  GtkWidget *label = gtk_label_new (text);

  gtk_label_set_xalign (GTK_LABEL (label), 0);
  gtk_label_set_wrap (GTK_LABEL (label), TRUE);
  gtk_label_set_max_width_chars (GTK_LABEL (label), 48);
  gtk_box_append (GTK_BOX (box), label);
  return label;
}

GtkWindow *
lamina_derive_dialog_present (GtkWindow                *parent,
                              LaminaLibrary            *library,
                              const LaminaConstruction *c,
                              const char               *author,
                              LaminaDeriveDone          done)
{
  DeriveDialog *d = g_new0 (DeriveDialog, 1);
  GtkWidget *box = gtk_box_new (GTK_ORIENTATION_VERTICAL, 8);
  GtkWidget *buttons = gtk_box_new (GTK_ORIENTATION_HORIZONTAL, 6);
  GtkWidget *cancel = gtk_button_new_with_mnemonic (_("_Cancel"));
  GtkWidget *derive = gtk_button_new_with_mnemonic (_("_Derive"));
  g_autofree char *intro = g_strdup_printf (_("A new draft from %s, without its code, for a new job. Keep:"),
                                            c->code ? c->code : c->name);

  d->window = GTK_WINDOW (gtk_window_new ());
  d->parent = g_object_ref (parent);
  d->library = g_object_ref (library);
  d->id = g_strdup (c->id);
  d->author = g_strdup (author);
  d->done = done;
  d->tags = g_ptr_array_new ();
  g_object_set_data_full (G_OBJECT (d->window), "lamina-derive-dialog", d, (GDestroyNotify) derive_dialog_free);

  gtk_window_set_title (d->window, _("Derive for a New Job"));
  gtk_window_set_modal (d->window, TRUE);
  gtk_window_set_resizable (d->window, FALSE);
  gtk_window_set_transient_for (d->window, parent);
  gtk_window_set_destroy_with_parent (d->window, TRUE);
  g_object_set (box, "margin-start", 18, "margin-end", 18, "margin-top", 18, "margin-bottom", 18, NULL);

  add_heading (box, intro);
  d->description = add_check (box, _("The _description"), c->description, FALSE);
  gtk_widget_set_sensitive (GTK_WIDGET (d->description), c->description != NULL && *c->description != '\0');
  d->notes = add_check (box, _("The _notes"), c->notes, FALSE);
  gtk_widget_set_sensitive (GTK_WIDGET (d->notes), c->notes != NULL && *c->notes != '\0');
  if (c->tags->len > 0)
    {
      GtkWidget *tags = gtk_flow_box_new ();

      gtk_widget_add_css_class (add_heading (box, _("Tags (untick a project's own)")), "dim-label");
      gtk_flow_box_set_selection_mode (GTK_FLOW_BOX (tags), GTK_SELECTION_NONE);
      gtk_flow_box_set_max_children_per_line (GTK_FLOW_BOX (tags), 3);
      for (guint i = 0; i < c->tags->len; i++)
        {
          GtkWidget *check = gtk_check_button_new_with_label (c->tags->pdata[i]);

          gtk_check_button_set_active (GTK_CHECK_BUTTON (check), TRUE);
          g_object_set_data_full (G_OBJECT (check), "lamina-tag", g_strdup (c->tags->pdata[i]), g_free);
          gtk_flow_box_append (GTK_FLOW_BOX (tags), check);
          g_ptr_array_add (d->tags, check);
        }
      gtk_box_append (GTK_BOX (box), tags);
    }

  gtk_widget_set_halign (buttons, GTK_ALIGN_END);
  gtk_widget_set_margin_top (buttons, 6);
  gtk_widget_add_css_class (derive, "suggested-action");
  gtk_box_append (GTK_BOX (buttons), cancel);
  gtk_box_append (GTK_BOX (buttons), derive);
  gtk_box_append (GTK_BOX (box), buttons);
  gtk_window_set_child (d->window, box);
  gtk_window_set_default_widget (d->window, derive);
  g_signal_connect_swapped (derive, "clicked", G_CALLBACK (lamina_derive_dialog_accept), d->window);
  g_signal_connect_swapped (cancel, "clicked", G_CALLBACK (gtk_window_destroy), d->window);
  gtk_window_present (d->window);
  return d->window;
}
