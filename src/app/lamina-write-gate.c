/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-write-gate.c: see lamina-write-gate.h. */
#define G_LOG_DOMAIN "lamina-app"

#include "config.h"

#include "lamina-write-gate.h"

#include <glib/gi18n.h>

#include "store/lamina-library-safety.h"

typedef struct
{
  char            *what;
  LaminaWriteFunc  func;
  gpointer         data;
  GDestroyNotify   data_free;
} Write;

struct _LaminaWriteGate
{
  GtkBox         parent_instance;

  GtkRevealer   *revealer;
  GtkLabel      *label;
  GtkWidget     *cancel;
  LaminaLibrary *library;
  GQueue         writes;       /* Write*, oldest first */
  GCancellable  *waiting;      /* the worker's wait, or NULL */
  char          *holder;       /* who holds the lock, if the system says */
  char          *text;         /* the line shown, or NULL */
  guint          retry;        /* a timeout, when no worker can wait */
  guint          clear;
};

G_DEFINE_FINAL_TYPE (LaminaWriteGate, lamina_write_gate, GTK_TYPE_BOX)

static void start_waiting (LaminaWriteGate *self);

static void
write_free (Write *write)
{
  if (write->data_free != NULL)
    write->data_free (write->data);
  g_free (write->what);
  g_free (write);
}

static void
show_text (LaminaWriteGate *self,
           const char      *text,
           gboolean         can_cancel)
{
  g_free (self->text);
  self->text = g_strdup (text);
  gtk_label_set_text (self->label, text ? text : "");
  gtk_widget_set_visible (self->cancel, can_cancel);
  gtk_revealer_set_reveal_child (self->revealer, text != NULL);
}

static char *
dup_what_list (LaminaWriteGate *self)
{
  GString *list = g_string_new (NULL);

  for (GList *l = self->writes.head; l != NULL; l = l->next)
    {
      Write *write = l->data;

      if (list->len > 0)
        g_string_append (list, _(", "));
      g_string_append (list, write->what);
    }
  return g_string_free (list, FALSE);
}

static void
update (LaminaWriteGate *self)
{
  g_autofree char *list = NULL;
  g_autofree char *text = NULL;

  if (g_queue_is_empty (&self->writes))
    {
      show_text (self, NULL, FALSE);
      return;
    }
  list = dup_what_list (self);
  if (self->holder != NULL)
    text = g_strdup_printf (_("Waiting for another program writing this library (%s)… Not yet written: %s."),
                            self->holder, list);
  else
    text = g_strdup_printf (_("Waiting for another program writing this library… Not yet written: %s."),
                            list);
  g_clear_handle_id (&self->clear, g_source_remove);
  show_text (self, text, TRUE);
}

/* ---- The worker: waits on a connection of its own ---------------------- */

typedef struct
{
  LaminaWriteGate *gate;     /* a reference */
  char            *holder;
  GCancellable    *cancellable;
} Holder;

static gboolean
holder_on_main (gpointer data)
{
  Holder *h = data;

  /* Only while this wait is the gate's current one. */
  if (h->gate->waiting == h->cancellable && !g_cancellable_is_cancelled (h->cancellable))
    {
      g_free (h->gate->holder);
      h->gate->holder = g_steal_pointer (&h->holder);
      update (h->gate);
    }
  g_object_unref (h->gate);
  g_object_unref (h->cancellable);
  g_free (h->holder);
  g_free (h);
  return G_SOURCE_REMOVE;
}

typedef struct
{
  LaminaLibrary   *worker;   /* used by the worker thread only */
  LaminaWriteGate *gate;     /* a reference, for the holder line */
  GMainContext    *context;
} Wait;

static void
wait_free (Wait *wait)
{
  g_clear_object (&wait->worker);
  g_clear_object (&wait->gate);
  g_main_context_unref (wait->context);
  g_free (wait);
}

/* Called in the worker thread by the busy handler of its connection. */
static void
on_worker_wait (LaminaLibrary *library,
                gboolean       waiting,
                const char    *holder,
                gpointer       user_data)
{
  GTask *task = user_data;
  Wait *wait = g_task_get_task_data (task);
  Holder *h;

  if (!waiting || holder == NULL)
    return;
  h = g_new0 (Holder, 1);
  h->gate = g_object_ref (wait->gate);
  h->holder = g_strdup (holder);
  h->cancellable = g_object_ref (g_task_get_cancellable (task));
  g_main_context_invoke (wait->context, holder_on_main, h);
}

static void
wait_in_thread (GTask        *task,
                gpointer      source,
                gpointer      task_data,
                GCancellable *cancellable)
{
  Wait *wait = task_data;
  GError *error = NULL;
  gboolean ok;

  lamina_library_set_wait_func (wait->worker, on_worker_wait, task);
  ok = lamina_library_wait_until_writable (wait->worker, 0, cancellable, &error);
  lamina_library_set_wait_func (wait->worker, NULL, NULL);
  lamina_library_close (wait->worker);
  if (ok)
    g_task_return_boolean (task, TRUE);
  else
    g_task_return_error (task, error);
}

static gboolean
retry_cb (gpointer data);

/* Runs the queued writes in order until one is refused as BUSY again. */
static void
run_queue (LaminaWriteGate *self,
           gboolean         wait_was_sound)
{
  while (!g_queue_is_empty (&self->writes))
    {
      Write *write = g_queue_peek_head (&self->writes);
      g_autoptr(GError) error = NULL;

      if (!write->func (write->data, &error) && lamina_write_gate_is_busy_error (error))
        {
          /* Taken again between the worker's look and this write. */
          if (wait_was_sound)
            start_waiting (self);
          else if (self->retry == 0)
            self->retry = g_timeout_add_seconds (1, retry_cb, self);
          update (self);
          return;
        }
      write_free (g_queue_pop_head (&self->writes));
    }
  update (self);
}

static gboolean
retry_cb (gpointer data)
{
  LaminaWriteGate *self = data;

  self->retry = 0;
  run_queue (self, FALSE);
  return G_SOURCE_REMOVE;
}

static void
on_free_cb (GObject      *source,
            GAsyncResult *result,
            gpointer      user_data)
{
  LaminaWriteGate *self = LAMINA_WRITE_GATE (source);
  GCancellable *cancellable = g_task_get_cancellable (G_TASK (result));
  g_autoptr(GError) error = NULL;
  gboolean ok = g_task_propagate_boolean (G_TASK (result), &error);

  if (self->waiting != cancellable || g_cancellable_is_cancelled (cancellable))
    return;   /* cancelled, or the gate was closed */
  g_clear_object (&self->waiting);
  if (!ok)
    g_debug ("waiting for the library's write lock: %s", error->message);
  run_queue (self, ok);
}

static void
start_waiting (LaminaWriteGate *self)
{
  g_autoptr(GTask) task = NULL;
  LaminaLibrary *worker;
  Wait *wait;

  if (self->waiting != NULL || self->retry != 0)
    return;
  worker = lamina_library_open (lamina_library_get_path (self->library), LAMINA_LIBRARY_OPEN_EXISTING, NULL);
  if (worker == NULL)
    {
      /* No second connection: look again every second from here. */
      self->retry = g_timeout_add_seconds (1, retry_cb, self);
      return;
    }
  self->waiting = g_cancellable_new ();
  wait = g_new0 (Wait, 1);
  wait->worker = worker;
  wait->gate = g_object_ref (self);
  wait->context = g_main_context_ref_thread_default ();
  task = g_task_new (self, self->waiting, on_free_cb, NULL);
  g_task_set_source_tag (task, start_waiting);
  g_task_set_task_data (task, wait, (GDestroyNotify) wait_free);
  g_task_run_in_thread (task, wait_in_thread);
}

/* ---- The gate ------------------------------------------------------------ */

static void
push (LaminaWriteGate *self,
      const char      *what,
      LaminaWriteFunc  func,
      gpointer         data,
      GDestroyNotify   data_free)
{
  Write *write = g_new0 (Write, 1);

  write->what = g_strdup (what);
  write->func = func;
  write->data = data;
  write->data_free = data_free;
  g_queue_push_tail (&self->writes, write);
}

void
lamina_write_gate_queue (LaminaWriteGate *self,
                         const char      *what,
                         LaminaWriteFunc  func,
                         gpointer         data,
                         GDestroyNotify   data_free)
{
  g_return_if_fail (LAMINA_IS_WRITE_GATE (self));
  g_return_if_fail (what != NULL && func != NULL);

  push (self, what, func, data, data_free);
  start_waiting (self);
  update (self);
}

void
lamina_write_gate_run (LaminaWriteGate *self,
                       const char      *what,
                       LaminaWriteFunc  func,
                       gpointer         data,
                       GDestroyNotify   data_free)
{
  g_autoptr(GError) error = NULL;

  g_return_if_fail (LAMINA_IS_WRITE_GATE (self));
  g_return_if_fail (what != NULL && func != NULL);

  /* Behind the writes that wait: the library sees them in order. */
  if (!g_queue_is_empty (&self->writes))
    {
      push (self, what, func, data, data_free);
      update (self);
      return;
    }
  if (!func (data, &error) && lamina_write_gate_is_busy_error (error))
    {
      lamina_write_gate_queue (self, what, func, data, data_free);
      return;
    }
  if (data_free != NULL)
    data_free (data);
}

gboolean
lamina_write_gate_is_waiting (LaminaWriteGate *self)
{
  g_return_val_if_fail (LAMINA_IS_WRITE_GATE (self), FALSE);
  return !g_queue_is_empty (&self->writes);
}

guint
lamina_write_gate_get_n_waiting (LaminaWriteGate *self)
{
  g_return_val_if_fail (LAMINA_IS_WRITE_GATE (self), 0);
  return self->writes.length;
}

const char *
lamina_write_gate_get_text (LaminaWriteGate *self)
{
  g_return_val_if_fail (LAMINA_IS_WRITE_GATE (self), NULL);
  return self->text;
}

gboolean
lamina_write_gate_is_busy_error (const GError *error)
{
  return g_error_matches (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_BUSY);
}

static gboolean
on_clear_cb (gpointer data)
{
  LaminaWriteGate *self = data;

  self->clear = 0;
  if (g_queue_is_empty (&self->writes))
    show_text (self, NULL, FALSE);
  return G_SOURCE_REMOVE;
}

void
lamina_write_gate_cancel (LaminaWriteGate *self)
{
  g_autofree char *list = NULL;
  g_autofree char *text = NULL;
  Write *write;

  g_return_if_fail (LAMINA_IS_WRITE_GATE (self));
  if (g_queue_is_empty (&self->writes))
    return;
  list = dup_what_list (self);
  g_cancellable_cancel (self->waiting);
  g_clear_object (&self->waiting);
  g_clear_handle_id (&self->retry, g_source_remove);
  g_clear_pointer (&self->holder, g_free);
  /* The data's free function undoes what waiting held (an open
   * construction keeps its edits on screen, saved with the next change). */
  while ((write = g_queue_pop_head (&self->writes)) != NULL)
    write_free (write);
  text = g_strdup_printf (_("Stopped waiting: nothing of this was written: %s. Edits stay on screen "
                            "and are saved with your next change."), list);
  show_text (self, text, FALSE);
  g_clear_handle_id (&self->clear, g_source_remove);
  self->clear = g_timeout_add_seconds (12, on_clear_cb, self);
}

static void
lamina_write_gate_dispose (GObject *object)
{
  LaminaWriteGate *self = LAMINA_WRITE_GATE (object);
  Write *write;

  g_cancellable_cancel (self->waiting);
  g_clear_object (&self->waiting);
  g_clear_handle_id (&self->retry, g_source_remove);
  g_clear_handle_id (&self->clear, g_source_remove);
  while ((write = g_queue_pop_head (&self->writes)) != NULL)
    write_free (write);
  g_clear_object (&self->library);
  G_OBJECT_CLASS (lamina_write_gate_parent_class)->dispose (object);
}

static void
lamina_write_gate_finalize (GObject *object)
{
  LaminaWriteGate *self = LAMINA_WRITE_GATE (object);

  g_free (self->holder);
  g_free (self->text);
  G_OBJECT_CLASS (lamina_write_gate_parent_class)->finalize (object);
}

static void
lamina_write_gate_class_init (LaminaWriteGateClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->dispose = lamina_write_gate_dispose;
  object_class->finalize = lamina_write_gate_finalize;
  gtk_widget_class_set_accessible_role (widget_class, GTK_ACCESSIBLE_ROLE_STATUS);
}

static void
lamina_write_gate_init (LaminaWriteGate *self)
{
  GtkWidget *box = gtk_box_new (GTK_ORIENTATION_HORIZONTAL, 12);

  g_queue_init (&self->writes);
  self->revealer = GTK_REVEALER (gtk_revealer_new ());
  self->label = GTK_LABEL (gtk_label_new (NULL));
  gtk_label_set_wrap (self->label, TRUE);
  gtk_label_set_xalign (self->label, 0);
  gtk_widget_set_hexpand (GTK_WIDGET (self->label), TRUE);
  self->cancel = gtk_button_new_with_mnemonic (_("_Cancel"));
  gtk_widget_set_valign (self->cancel, GTK_ALIGN_CENTER);
  gtk_widget_set_tooltip_text (self->cancel, _("Stop waiting; the waiting changes are not written"));
  g_signal_connect_object (self->cancel, "clicked", G_CALLBACK (lamina_write_gate_cancel), self,
                           G_CONNECT_SWAPPED);
  gtk_widget_add_css_class (box, "lamina-banner");
  gtk_box_append (GTK_BOX (box), GTK_WIDGET (self->label));
  gtk_box_append (GTK_BOX (box), self->cancel);
  gtk_revealer_set_child (self->revealer, box);
  gtk_orientable_set_orientation (GTK_ORIENTABLE (self), GTK_ORIENTATION_VERTICAL);
  gtk_box_append (GTK_BOX (self), GTK_WIDGET (self->revealer));
}

GtkWidget *
lamina_write_gate_new (LaminaLibrary *library)
{
  LaminaWriteGate *self;

  g_return_val_if_fail (LAMINA_IS_LIBRARY (library), NULL);

  self = g_object_new (LAMINA_TYPE_WRITE_GATE, NULL);
  self->library = g_object_ref (library);
  if (g_getenv ("LAMINA_BUSY_TIMEOUT") == NULL)
    lamina_library_set_busy_timeout (library, LAMINA_WRITE_GATE_MAIN_WAIT);
  return GTK_WIDGET (self);
}
