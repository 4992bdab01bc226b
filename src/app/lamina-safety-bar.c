/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-safety-bar.c: see lamina-safety-bar.h. */
#define G_LOG_DOMAIN "lamina-app"

#include "config.h"

#include "lamina-safety-bar.h"

#include <glib/gi18n.h>

#include "lamina-library-safety.h"

struct _LaminaSafetyBar
{
  GtkBox         parent_instance;

  GtkWidget     *revealer;
  GtkLabel      *label;
  LaminaLibrary *library;
  GCancellable  *cancellable;
  char          *read_only;   /* the standing line, or NULL */
  char          *text;        /* the line shown, or NULL */
  guint          clear_timeout;
};

G_DEFINE_FINAL_TYPE (LaminaSafetyBar, lamina_safety_bar, GTK_TYPE_BOX)

static void
show_text (LaminaSafetyBar *self,
           const char      *text)
{
  g_free (self->text);
  self->text = g_strdup (text ? text : self->read_only);
  gtk_label_set_text (self->label, self->text ? self->text : "");
  gtk_revealer_set_reveal_child (GTK_REVEALER (self->revealer), self->text != NULL);
}

static gboolean
on_clear_cb (gpointer data)
{
  LaminaSafetyBar *self = data;

  self->clear_timeout = 0;
  show_text (self, NULL);
  return G_SOURCE_REMOVE;
}

static void
show_for_a_while (LaminaSafetyBar *self,
                  const char      *text)
{
  show_text (self, text);
  g_clear_handle_id (&self->clear_timeout, g_source_remove);
  self->clear_timeout = g_timeout_add_seconds (12, on_clear_cb, self);
}

/* The window's writes run on the main thread, so the line is drawn when
 * the wait is over: it then says that it waited, and for whom. */
static void
on_wait (LaminaLibrary *library,
         gboolean       waiting,
         const char    *holder,
         gpointer       user_data)
{
  LaminaSafetyBar *self = user_data;
  g_autofree char *text = NULL;

  if (!waiting)
    {
      if (self->text != NULL && self->text != self->read_only)
        show_for_a_while (self, self->text);
      return;
    }
  if (holder != NULL)
    text = g_strdup_printf (_("Waiting for another program writing this library (%s)…"), holder);
  else
    text = g_strdup (_("Waiting for another program writing this library…"));
  show_text (self, text);
}

static void
backup_thread (GTask        *task,
               gpointer      source,
               gpointer      task_data,
               GCancellable *cancellable)
{
  g_autoptr(LaminaLibrary) library = NULL;
  g_autoptr(GError) error = NULL;
  g_autofree char *made = NULL;

  library = lamina_library_open (task_data, LAMINA_LIBRARY_OPEN_EXISTING, &error);
  if (library != NULL)
    made = lamina_library_backup_daily (library, &error);
  if (error != NULL)
    g_task_return_error (task, g_steal_pointer (&error));
  else
    g_task_return_pointer (task, g_steal_pointer (&made), g_free);
}

static void
on_backup_done_cb (GObject      *source,
                   GAsyncResult *result,
                   gpointer      user_data)
{
  g_autoptr(GError) error = NULL;
  g_autofree char *made = g_task_propagate_pointer (G_TASK (result), &error);
  LaminaSafetyBar *self;

  if (g_error_matches (error, G_IO_ERROR, G_IO_ERROR_CANCELLED))
    return;
  self = LAMINA_SAFETY_BAR (source);
  if (error != NULL)
    {
      g_autofree char *text = g_strdup_printf (_("The day’s backup of the library was not made: %s"),
                                               error->message);

      show_text (self, text);
    }
  else if (made != NULL)
    g_debug ("the day's backup: %s", made);
}

static void
lamina_safety_bar_dispose (GObject *object)
{
  LaminaSafetyBar *self = LAMINA_SAFETY_BAR (object);

  g_cancellable_cancel (self->cancellable);
  g_clear_handle_id (&self->clear_timeout, g_source_remove);
  if (self->library != NULL)
    lamina_library_set_wait_func (self->library, NULL, NULL);
  g_clear_object (&self->library);
  G_OBJECT_CLASS (lamina_safety_bar_parent_class)->dispose (object);
}

static void
lamina_safety_bar_finalize (GObject *object)
{
  LaminaSafetyBar *self = LAMINA_SAFETY_BAR (object);

  g_clear_object (&self->cancellable);
  g_free (self->read_only);
  g_free (self->text);
  G_OBJECT_CLASS (lamina_safety_bar_parent_class)->finalize (object);
}

static void
lamina_safety_bar_class_init (LaminaSafetyBarClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->dispose = lamina_safety_bar_dispose;
  object_class->finalize = lamina_safety_bar_finalize;
  gtk_widget_class_set_accessible_role (widget_class, GTK_ACCESSIBLE_ROLE_STATUS);
}

static void
lamina_safety_bar_init (LaminaSafetyBar *self)
{
  GtkWidget *box = gtk_box_new (GTK_ORIENTATION_HORIZONTAL, 12);

  self->cancellable = g_cancellable_new ();
  self->revealer = gtk_revealer_new ();
  self->label = GTK_LABEL (gtk_label_new (NULL));
  gtk_label_set_wrap (self->label, TRUE);
  gtk_label_set_xalign (self->label, 0);
  gtk_widget_set_hexpand (GTK_WIDGET (self->label), TRUE);
  gtk_widget_add_css_class (box, "lamina-banner");
  gtk_box_append (GTK_BOX (box), GTK_WIDGET (self->label));
  gtk_revealer_set_child (GTK_REVEALER (self->revealer), box);
  gtk_orientable_set_orientation (GTK_ORIENTABLE (self), GTK_ORIENTATION_VERTICAL);
  gtk_box_append (GTK_BOX (self), self->revealer);
}

GtkWidget *
lamina_safety_bar_new (LaminaLibrary *library)
{
  LaminaSafetyBar *self;
  const char *reason;

  g_return_val_if_fail (LAMINA_IS_LIBRARY (library), NULL);

  self = g_object_new (LAMINA_TYPE_SAFETY_BAR, NULL);
  self->library = g_object_ref (library);
  reason = lamina_library_get_read_only_reason (library);
  if (reason != NULL)
    self->read_only = g_strdup_printf (_("Read-only: %s cannot be changed here (%s). Browsing, "
                                         "sheets and exports work; editing and review are off."),
                                       lamina_library_get_path (library), reason);
  show_text (self, NULL);
  /* The window's connection waits only a moment for another program's
   * lock (LaminaWriteGate queues the write and waits in a worker); the
   * line is for a wait set longer by LAMINA_BUSY_TIMEOUT. */
  lamina_library_set_wait_func (library, on_wait, self);
  /* A library made just now has nothing worth a copy yet. */
  if (reason == NULL && lamina_library_get_opened_version (library) != 0)
    {
      g_autoptr(GTask) task = g_task_new (self, self->cancellable, on_backup_done_cb, NULL);

      g_task_set_task_data (task, g_strdup (lamina_library_get_path (library)), g_free);
      g_task_run_in_thread (task, backup_thread);
    }
  return GTK_WIDGET (self);
}

const char *
lamina_safety_bar_get_text (LaminaSafetyBar *self)
{
  g_return_val_if_fail (LAMINA_IS_SAFETY_BAR (self), NULL);
  return self->text;
}
