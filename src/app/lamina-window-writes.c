/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-window-writes.c: the window's writes to the library through its
 * LaminaWriteGate, so that none waits on the main thread for another
 * program's write lock: the open construction's saves (edits, undo, redo),
 * a check, a deletion and its undo.  Each runs at once when it can, else
 * queued in the order asked for; see lamina-write-gate.h. */
#define G_LOG_DOMAIN "lamina-app"

#include "config.h"

#include "lamina-window-private.h"

#include <glib/gi18n.h>

#include "lamina-editor.h"

/* ---- The open construction's saves -------------------------------------- */

typedef struct
{
  LaminaWindow   *window;   /* a reference */
  LaminaDocument *document; /* a reference */
} HeldSave;

static void
held_save_free (HeldSave *save)
{
  const char *id = lamina_document_get_id (save->document);

  /* Saved, or the wait cancelled: the next change saves as usual. */
  lamina_document_release_held (save->document);
  if (save->window->held_documents != NULL
      && g_hash_table_lookup (save->window->held_documents, id) == save->document)
    g_hash_table_remove (save->window->held_documents, id);
  g_object_unref (save->document);
  g_object_unref (save->window);
  g_free (save);
}

static gboolean
held_save_write (gpointer   data,
                 GError   **error)
{
  HeldSave *save = data;
  gboolean ok = lamina_document_save_held (save->document, error);

  if (ok && save->window->document != save->document)
    lamina_window_refresh_list (save->window);
  return ok;
}

static void
on_save_busy_cb (LaminaDocument *document,
                 LaminaWindow   *self)
{
  const LaminaConstruction *state = lamina_document_get_construction (document);
  g_autofree char *what = g_strdup_printf (_("the edits to %s"),
                                           state->code && *state->code ? state->code : state->name);
  HeldSave *save = g_new0 (HeldSave, 1);

  save->window = g_object_ref (self);
  save->document = g_object_ref (document);
  if (self->held_documents == NULL)
    self->held_documents = g_hash_table_new_full (g_str_hash, g_str_equal, g_free, g_object_unref);
  g_hash_table_replace (self->held_documents, g_strdup (lamina_document_get_id (document)),
                        g_object_ref (document));
  lamina_write_gate_queue (self->write_gate, what, held_save_write, save, (GDestroyNotify) held_save_free);
}

void
lamina_window_watch_document (LaminaWindow   *self,
                              LaminaDocument *document)
{
  /* Connected for the document's life, not while it is open: edits that
   * wait are written after the user has moved on to another one. */
  if (g_signal_handler_find (document, G_SIGNAL_MATCH_FUNC | G_SIGNAL_MATCH_DATA, 0, 0, NULL,
                             on_save_busy_cb, self) == 0)
    g_signal_connect_object (document, "save-busy", G_CALLBACK (on_save_busy_cb), self, 0);
}

LaminaDocument *
lamina_window_dup_held_document (LaminaWindow *self,
                                 const char   *id)
{
  LaminaDocument *document;

  if (self->held_documents == NULL)
    return NULL;
  document = g_hash_table_lookup (self->held_documents, id);
  return document ? g_object_ref (document) : NULL;
}

gboolean
lamina_window_check_no_waiting_writes (LaminaWindow *self)
{
  if (!lamina_write_gate_is_waiting (self->write_gate))
    return TRUE;
  lamina_window_notify (self, _("Not now: changes wait for another program writing this library. "
                                "A review names the revision those changes make; ask again when "
                                "they are written."));
  return FALSE;
}

/* ---- A check ----------------------------------------------------------- */

typedef struct
{
  LaminaWindow *window;
  char         *id;
  int           revision;
  char         *reviewer;
} Act;

static void
act_free (Act *act)
{
  g_object_unref (act->window);
  g_free (act->id);
  g_free (act->reviewer);
  g_free (act);
}

static Act *
act_new (LaminaWindow *self,
         const char   *id,
         int           revision,
         const char   *reviewer)
{
  Act *act = g_new0 (Act, 1);

  act->window = g_object_ref (self);
  act->id = g_strdup (id);
  act->revision = revision;
  act->reviewer = g_strdup (reviewer);
  return act;
}

static gboolean
is_open (LaminaWindow *self,
         const char   *id)
{
  return self->document != NULL && g_strcmp0 (lamina_document_get_id (self->document), id) == 0;
}

static gboolean
check_write (gpointer   data,
             GError   **error)
{
  Act *act = data;
  LaminaWindow *self = act->window;
  g_autoptr(GError) local = NULL;
  g_autoptr(GError) reload_error = NULL;
  g_autofree char *message = NULL;

  if (!lamina_library_mark_checked (self->library, act->id, act->revision, act->reviewer, &local))
    {
      if (lamina_write_gate_is_busy_error (local))
        {
          g_propagate_error (error, g_steal_pointer (&local));
          return FALSE;
        }
      lamina_window_notify (self, local->message);
      return TRUE;
    }
  message = g_strdup_printf (_("Revision %d checked by %s"), act->revision, act->reviewer);
  if (is_open (self, act->id))
    lamina_document_reload (self->document, &reload_error);
  lamina_window_refresh_list (self);
  lamina_window_notify (self, reload_error ? reload_error->message : message);
  return TRUE;
}

void
lamina_window_check_revision (LaminaWindow *self,
                              const char   *id,
                              int           revision,
                              const char   *reviewer)
{
  g_autofree char *what = g_strdup_printf (_("the check of revision %d"), revision);

  lamina_write_gate_run (self->write_gate, what, check_write, act_new (self, id, revision, reviewer),
                         (GDestroyNotify) act_free);
}

/* ---- A deletion and its undo ---------------------------------------------- */

typedef struct
{
  Act  *act;
  char *message;
} Deletion;

static void
deletion_free (Deletion *deletion)
{
  act_free (deletion->act);
  g_free (deletion->message);
  g_free (deletion);
}

static gboolean
delete_write (gpointer   data,
              GError   **error)
{
  Deletion *deletion = data;
  LaminaWindow *self = deletion->act->window;
  const char *id = deletion->act->id;
  g_autoptr(GError) local = NULL;

  if (!lamina_library_delete_construction (self->library, id, deletion->act->reviewer, &local))
    {
      if (lamina_write_gate_is_busy_error (local))
        {
          g_propagate_error (error, g_steal_pointer (&local));
          return FALSE;
        }
      lamina_window_notify (self, local->message);
      return TRUE;
    }
  if (is_open (self, id))
    {
      g_signal_handlers_disconnect_by_data (self->document, self);
      g_clear_object (&self->document);
      lamina_editor_set_document (self->editor, NULL);
      gtk_stack_set_visible_child_name (self->main_stack, "empty");
    }
  lamina_window_refresh_list (self);
  lamina_window_show_undo_delete (self, deletion->message, id);
  return TRUE;
}

void
lamina_window_delete_construction (LaminaWindow *self,
                                   const char   *id,
                                   const char   *reviewer,
                                   const char   *message)
{
  Deletion *deletion = g_new0 (Deletion, 1);
  g_autofree char *what = NULL;

  deletion->act = act_new (self, id, 0, reviewer);
  deletion->message = g_strdup (message);
  what = g_strdup_printf (_("the deletion of “%s”"),
                          is_open (self, id) ? lamina_document_get_construction (self->document)->name : id);
  lamina_write_gate_run (self->write_gate, what, delete_write, deletion, (GDestroyNotify) deletion_free);
}

static gboolean
restore_write (gpointer   data,
               GError   **error)
{
  Act *act = data;
  g_autoptr(GError) local = NULL;

  if (!lamina_library_restore_construction (act->window->library, act->id, &local))
    {
      if (lamina_write_gate_is_busy_error (local))
        {
          g_propagate_error (error, g_steal_pointer (&local));
          return FALSE;
        }
      lamina_window_notify (act->window, local->message);
      return TRUE;
    }
  lamina_window_refresh_list (act->window);
  lamina_window_open (act->window, act->id, NULL);
  return TRUE;
}

void
lamina_window_restore_construction (LaminaWindow *self,
                                    const char   *id)
{
  lamina_write_gate_run (self->write_gate, _("bringing back a deleted construction"), restore_write,
                         act_new (self, id, 0, NULL), (GDestroyNotify) act_free);
}
