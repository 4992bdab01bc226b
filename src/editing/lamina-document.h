/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-document.h: one construction open for editing.  Holds the editor
 * state, its undo stack and its calculation, and writes every committed
 * change to the library at once (no "save changes?" step).  A save refused
 * because someone else saved meanwhile keeps the user's state and reports
 * a conflict to resolve.  No GTK. */
#pragma once

#include <glib-object.h>

#include "lamina-calc.h"
#include "lamina-construction.h"
#include "store/lamina-library.h"

G_BEGIN_DECLS

#define LAMINA_TYPE_DOCUMENT (lamina_document_get_type ())
G_DECLARE_FINAL_TYPE (LaminaDocument, lamina_document, LAMINA, DOCUMENT, GObject)

typedef enum
{
  LAMINA_APPLY_DEFAULT = 0,
  LAMINA_APPLY_LIVE    = 1 << 0, /* recalculate only; saved by _commit */
} LaminaApplyFlags;

LaminaDocument           *lamina_document_new          (LaminaLibrary       *library,
                                                        const char          *id,
                                                        GError             **error);
LaminaLibrary            *lamina_document_get_library  (LaminaDocument      *self);
const char               *lamina_document_get_id       (LaminaDocument      *self);
const LaminaConstruction *lamina_document_get_construction (LaminaDocument  *self);
/* NULL when the state cannot be calculated; see _get_calc_error. */
const LaminaResult       *lamina_document_get_result   (LaminaDocument      *self);
const char               *lamina_document_get_calc_error (LaminaDocument    *self);
/* The revision the state is based on (the latest saved). */
int                       lamina_document_get_base_revision (LaminaDocument *self);
/* A message while a save is refused (stale revision), else NULL. */
const char               *lamina_document_get_conflict (LaminaDocument      *self);
void                      lamina_document_set_author   (LaminaDocument      *self,
                                                        const char          *author);

/* Makes @next (taken) the state: records undo (steps with the same @group
 * merge), recalculates and, unless LIVE, saves. */
void                      lamina_document_apply        (LaminaDocument      *self,
                                                        LaminaConstruction  *next,
                                                        const char          *group,
                                                        LaminaApplyFlags     flags);
/* Saves a state applied LIVE and ends its undo group. */
gboolean                  lamina_document_commit       (LaminaDocument      *self,
                                                        GError             **error);
gboolean                  lamina_document_can_undo     (LaminaDocument      *self);
gboolean                  lamina_document_can_redo     (LaminaDocument      *self);
void                      lamina_document_undo         (LaminaDocument      *self);
void                      lamina_document_redo         (LaminaDocument      *self);
/* While another program holds the library's write lock: a save refused
 * as BUSY emits "save-busy" and holds this and later edits (the state
 * stays on screen, unsaved); _save_held writes them at once (FALSE with
 * BUSY holds them again), _release_held lets the next change try again
 * (the waiting was cancelled). */
gboolean                  lamina_document_save_held    (LaminaDocument      *self,
                                                        GError             **error);
void                      lamina_document_release_held (LaminaDocument      *self);
gboolean                  lamina_document_is_held      (LaminaDocument      *self);
/* Conflict resolution: put this state on top of the newest revision, or
 * drop it and load the newest one. */
gboolean                  lamina_document_keep_mine    (LaminaDocument      *self,
                                                        GError             **error);
gboolean                  lamina_document_reload       (LaminaDocument      *self,
                                                        GError             **error);

G_END_DECLS
