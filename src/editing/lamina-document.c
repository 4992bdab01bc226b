/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "lamina-app"

#include "config.h"

#include "lamina-document.h"
#include "lamina-library-safety.h"

#include <glib/gi18n.h>

#include "lamina-undo-stack.h"

struct _LaminaDocument
{
  GObject             parent_instance;

  /* owned */
  LaminaLibrary      *library;
  char               *id;
  LaminaConstruction *state;
  LaminaResult       *result;
  char               *calc_error;
  char               *conflict;
  char               *author;
  LaminaUndoStack    *undo;
  int                 base_revision;
  LaminaStatus        base_status;
  gboolean            unsaved;
  /* A save was refused because another program holds the library's write
   * lock: later edits are kept (not saved one by one) until
   * lamina_document_save_held writes them all at once. */
  gboolean            held;
};

G_DEFINE_FINAL_TYPE (LaminaDocument, lamina_document, G_TYPE_OBJECT)

enum {
  PROP_0,
  PROP_CONFLICT,
  N_PROPS
};

enum {
  CHANGED,
  NOTICE,
  SAVE_BUSY,
  N_SIGNALS
};

static GParamSpec *properties[N_PROPS];
static guint signals[N_SIGNALS];

static void
lamina_document_finalize (GObject *object)
{
  LaminaDocument *self = LAMINA_DOCUMENT (object);

  g_clear_object (&self->library);
  g_clear_pointer (&self->id, g_free);
  g_clear_pointer (&self->state, lamina_construction_free);
  g_clear_pointer (&self->result, lamina_result_free);
  g_clear_pointer (&self->calc_error, g_free);
  g_clear_pointer (&self->conflict, g_free);
  g_clear_pointer (&self->author, g_free);
  g_clear_pointer (&self->undo, lamina_undo_stack_free);

  G_OBJECT_CLASS (lamina_document_parent_class)->finalize (object);
}

static void
lamina_document_get_property (GObject    *object,
                              guint       prop_id,
                              GValue     *value,
                              GParamSpec *pspec)
{
  LaminaDocument *self = LAMINA_DOCUMENT (object);

  switch (prop_id)
    {
    case PROP_CONFLICT:
      g_value_set_string (value, self->conflict);
      break;
    default:
      G_OBJECT_WARN_INVALID_PROPERTY_ID (object, prop_id, pspec);
    }
}

static void
lamina_document_class_init (LaminaDocumentClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);

  object_class->finalize = lamina_document_finalize;
  object_class->get_property = lamina_document_get_property;

  properties[PROP_CONFLICT] =
    g_param_spec_string ("conflict", NULL, NULL, NULL,
                         G_PARAM_READABLE | G_PARAM_STATIC_STRINGS | G_PARAM_EXPLICIT_NOTIFY);
  g_object_class_install_properties (object_class, N_PROPS, properties);

  /* The state or its result changed (also while dragging). */
  signals[CHANGED] = g_signal_new ("changed", G_TYPE_FROM_CLASS (klass), G_SIGNAL_RUN_LAST,
                                   0, NULL, NULL, NULL, G_TYPE_NONE, 0);
  /* Something the user should read: a new draft over an approved
   * revision, a failed save. */
  signals[NOTICE] = g_signal_new ("notice", G_TYPE_FROM_CLASS (klass), G_SIGNAL_RUN_LAST,
                                  0, NULL, NULL, NULL, G_TYPE_NONE, 1, G_TYPE_STRING);
  /* A save was refused because another program holds the library's write
   * lock (LAMINA_LIBRARY_ERROR_BUSY): the edits are held from now on;
   * the handler arranges for lamina_document_save_held. */
  signals[SAVE_BUSY] = g_signal_new ("save-busy", G_TYPE_FROM_CLASS (klass), G_SIGNAL_RUN_LAST,
                                     0, NULL, NULL, NULL, G_TYPE_NONE, 0);
}

static void
lamina_document_init (LaminaDocument *self)
{
  self->undo = lamina_undo_stack_new (500);
}

static void
set_conflict (LaminaDocument *self,
              const char     *message)
{
  if (g_strcmp0 (self->conflict, message) == 0)
    return;
  g_free (self->conflict);
  self->conflict = g_strdup (message);
  g_object_notify_by_pspec (G_OBJECT (self), properties[PROP_CONFLICT]);
}

static void
recalculate (LaminaDocument *self)
{
  g_autoptr(GError) error = NULL;

  g_clear_pointer (&self->result, lamina_result_free);
  g_clear_pointer (&self->calc_error, g_free);
  self->result = lamina_calculate (self->state, &error);
  if (self->result == NULL)
    self->calc_error = g_strdup (error->message);
}

static void
take_state (LaminaDocument     *self,
            LaminaConstruction *state)
{
  g_clear_pointer (&self->state, lamina_construction_free);
  self->state = state;
  recalculate (self);
}

static void
emit_changed (LaminaDocument *self)
{
  g_signal_emit (self, signals[CHANGED], 0);
}

static gboolean
save (LaminaDocument  *self,
      GError         **error)
{
  g_autoptr(LaminaConstruction) copy = lamina_construction_copy (self->state);
  g_autoptr(GError) local_error = NULL;
  LaminaStatus was = self->base_status;
  int was_revision = self->base_revision;

  if (self->held)
    {
      g_set_error_literal (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_BUSY,
                           _("The edits wait for another program writing this library"));
      return FALSE;
    }
  if (!lamina_library_save_construction (self->library, copy, self->base_revision,
                                         self->author, &local_error))
    {
      if (g_error_matches (local_error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_BUSY))
        {
          self->held = TRUE;
          g_signal_emit (self, signals[SAVE_BUSY], 0);
        }
      else if (g_error_matches (local_error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_STALE))
        set_conflict (self, local_error->message);
      else
        g_signal_emit (self, signals[NOTICE], 0, local_error->message);
      g_propagate_error (error, g_steal_pointer (&local_error));
      return FALSE;
    }
  self->unsaved = FALSE;
  self->base_revision = copy->revision;
  self->base_status = copy->status;
  /* Keep the library data (revision, status, who) in the state shown. */
  self->state->revision = copy->revision;
  self->state->status = copy->status;
  g_free (self->state->modified_by), self->state->modified_by = g_strdup (copy->modified_by);
  g_free (self->state->modified_at), self->state->modified_at = g_strdup (copy->modified_at);
  g_free (self->state->draft_stamp), self->state->draft_stamp = g_strdup (copy->draft_stamp);
  g_free (self->state->checked_by), self->state->checked_by = g_strdup (copy->checked_by);
  g_free (self->state->approved_by), self->state->approved_by = g_strdup (copy->approved_by);
  g_free (self->state->approved_at), self->state->approved_at = g_strdup (copy->approved_at);
  set_conflict (self, NULL);

  if (copy->revision < was_revision)
    {
      g_autofree char *text = NULL;

      /* The store removed a draft brought back to the approved build-up. */
      text = g_strdup_printf (_("Back to approved revision %d; the draft was removed"), copy->revision);
      g_signal_emit (self, signals[NOTICE], 0, text);
    }
  else if (was != LAMINA_STATUS_DRAFT && copy->revision != was_revision)
    {
      g_autofree char *text = NULL;

      if (was == LAMINA_STATUS_APPROVED)
        text = g_strdup_printf (_("Approved revision %d stays as it was; this edit is draft revision %d"),
                                was_revision, copy->revision);
      else
        text = g_strdup_printf (_("Checked revision %d stays in the history; this edit is draft revision %d"),
                                was_revision, copy->revision);
      g_signal_emit (self, signals[NOTICE], 0, text);
    }
  return TRUE;
}

static gboolean
load (LaminaDocument  *self,
      GError         **error)
{
  LaminaConstruction *state;

  state = lamina_library_dup_construction (self->library, self->id, 0, error);
  if (state == NULL)
    return FALSE;
  self->base_revision = state->revision;
  self->base_status = state->status;
  self->unsaved = FALSE;
  lamina_undo_stack_clear (self->undo);
  set_conflict (self, NULL);
  take_state (self, state);
  emit_changed (self);
  return TRUE;
}

LaminaDocument *
lamina_document_new (LaminaLibrary  *library,
                     const char     *id,
                     GError        **error)
{
  g_autoptr(LaminaDocument) self = NULL;

  g_return_val_if_fail (LAMINA_IS_LIBRARY (library), NULL);
  g_return_val_if_fail (id != NULL, NULL);

  self = g_object_new (LAMINA_TYPE_DOCUMENT, NULL);
  self->library = g_object_ref (library);
  self->id = g_strdup (id);
  if (!load (self, error))
    return NULL;
  return g_steal_pointer (&self);
}

LaminaLibrary *
lamina_document_get_library (LaminaDocument *self)
{
  g_return_val_if_fail (LAMINA_IS_DOCUMENT (self), NULL);
  return self->library;
}

const char *
lamina_document_get_id (LaminaDocument *self)
{
  g_return_val_if_fail (LAMINA_IS_DOCUMENT (self), NULL);
  return self->id;
}

const LaminaConstruction *
lamina_document_get_construction (LaminaDocument *self)
{
  g_return_val_if_fail (LAMINA_IS_DOCUMENT (self), NULL);
  return self->state;
}

const LaminaResult *
lamina_document_get_result (LaminaDocument *self)
{
  g_return_val_if_fail (LAMINA_IS_DOCUMENT (self), NULL);
  return self->result;
}

const char *
lamina_document_get_calc_error (LaminaDocument *self)
{
  g_return_val_if_fail (LAMINA_IS_DOCUMENT (self), NULL);
  return self->calc_error;
}

int
lamina_document_get_base_revision (LaminaDocument *self)
{
  g_return_val_if_fail (LAMINA_IS_DOCUMENT (self), 0);
  return self->base_revision;
}

const char *
lamina_document_get_conflict (LaminaDocument *self)
{
  g_return_val_if_fail (LAMINA_IS_DOCUMENT (self), NULL);
  return self->conflict;
}

void
lamina_document_set_author (LaminaDocument *self,
                            const char     *author)
{
  g_return_if_fail (LAMINA_IS_DOCUMENT (self));
  g_free (self->author);
  self->author = author != NULL && *author ? g_strdup (author) : NULL;
}

void
lamina_document_apply (LaminaDocument     *self,
                       LaminaConstruction *next,
                       const char         *group,
                       LaminaApplyFlags    flags)
{
  g_autoptr(GError) error = NULL;

  g_return_if_fail (LAMINA_IS_DOCUMENT (self));
  g_return_if_fail (next != NULL);

  /* A read-only library is for browsing: no edit is taken, and the views
   * go back to what is stored. */
  if (!lamina_library_check_writable (self->library, &error))
    {
      lamina_construction_free (next);
      g_signal_emit (self, signals[NOTICE], 0, error->message);
      emit_changed (self);
      return;
    }
  lamina_undo_stack_push (self->undo, self->state, group);
  self->unsaved = TRUE;
  take_state (self, next);
  if ((flags & LAMINA_APPLY_LIVE) == 0)
    save (self, NULL);
  emit_changed (self);
}

gboolean
lamina_document_commit (LaminaDocument  *self,
                        GError         **error)
{
  gboolean ok;

  g_return_val_if_fail (LAMINA_IS_DOCUMENT (self), FALSE);

  lamina_undo_stack_seal (self->undo);
  if (!self->unsaved)
    return TRUE;
  ok = save (self, error);
  emit_changed (self);
  return ok;
}

gboolean
lamina_document_can_undo (LaminaDocument *self)
{
  g_return_val_if_fail (LAMINA_IS_DOCUMENT (self), FALSE);
  return lamina_undo_stack_can_undo (self->undo);
}

gboolean
lamina_document_can_redo (LaminaDocument *self)
{
  g_return_val_if_fail (LAMINA_IS_DOCUMENT (self), FALSE);
  return lamina_undo_stack_can_redo (self->undo);
}

void
lamina_document_undo (LaminaDocument *self)
{
  LaminaConstruction *state;

  g_return_if_fail (LAMINA_IS_DOCUMENT (self));

  state = lamina_undo_stack_undo (self->undo, self->state);
  if (state == NULL)
    return;
  self->unsaved = TRUE;
  take_state (self, state);
  save (self, NULL);
  emit_changed (self);
}

void
lamina_document_redo (LaminaDocument *self)
{
  LaminaConstruction *state;

  g_return_if_fail (LAMINA_IS_DOCUMENT (self));

  state = lamina_undo_stack_redo (self->undo, self->state);
  if (state == NULL)
    return;
  self->unsaved = TRUE;
  take_state (self, state);
  save (self, NULL);
  emit_changed (self);
}

gboolean
lamina_document_save_held (LaminaDocument  *self,
                           GError         **error)
{
  gboolean ok;

  g_return_val_if_fail (LAMINA_IS_DOCUMENT (self), FALSE);
  if (!self->held)
    return TRUE;
  self->held = FALSE;
  if (!self->unsaved)
    return TRUE;
  /* BUSY again holds them again, without a second signal: the caller
   * keeps waiting. */
  g_signal_handlers_block_matched (self, G_SIGNAL_MATCH_ID, signals[SAVE_BUSY], 0, NULL, NULL, NULL);
  ok = save (self, error);
  g_signal_handlers_unblock_matched (self, G_SIGNAL_MATCH_ID, signals[SAVE_BUSY], 0, NULL, NULL, NULL);
  emit_changed (self);
  return ok;
}

void
lamina_document_release_held (LaminaDocument *self)
{
  g_return_if_fail (LAMINA_IS_DOCUMENT (self));
  self->held = FALSE;
}

gboolean
lamina_document_is_held (LaminaDocument *self)
{
  g_return_val_if_fail (LAMINA_IS_DOCUMENT (self), FALSE);
  return self->held;
}

gboolean
lamina_document_keep_mine (LaminaDocument  *self,
                           GError         **error)
{
  g_autoptr(LaminaConstruction) latest = NULL;
  gboolean ok;

  g_return_val_if_fail (LAMINA_IS_DOCUMENT (self), FALSE);

  latest = lamina_library_dup_construction (self->library, self->id, 0, error);
  if (latest == NULL)
    return FALSE;
  self->base_revision = latest->revision;
  self->base_status = latest->status;
  self->unsaved = TRUE;
  ok = save (self, error);
  emit_changed (self);
  return ok;
}

gboolean
lamina_document_reload (LaminaDocument  *self,
                        GError         **error)
{
  g_return_val_if_fail (LAMINA_IS_DOCUMENT (self), FALSE);
  return load (self, error);
}
