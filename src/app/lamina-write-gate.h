/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-write-gate.h: the window's writes while another program holds
 * the library's write lock (a long import from a terminal).
 *
 * The window's own connection waits only a moment for the lock
 * (LAMINA_WRITE_GATE_MAIN_WAIT) so that the window never freezes.  A
 * write refused as BUSY is queued here: a banner says "Waiting for another
 * program writing this library (who)…" with Cancel, a worker thread on a
 * connection of its own waits until the lock is free (taking it for no
 * longer than a moment), and the queued writes then run in the order they
 * were asked for, on the window's connection.  Writes asked for while
 * others wait go behind them.  Cancel drops the waiting writes and says
 * which; nothing of them was written.  A write is run once: it either
 * wrote or was refused whole (SQLite's BEGIN IMMEDIATE takes the lock
 * before anything is written). */
#pragma once

#include <gtk/gtk.h>

#include "store/lamina-library.h"

G_BEGIN_DECLS

/* Seconds the window's own connection waits for another program's lock
 * before a write is handed to the gate. */
#define LAMINA_WRITE_GATE_MAIN_WAIT 0.2

#define LAMINA_TYPE_WRITE_GATE (lamina_write_gate_get_type ())
G_DECLARE_FINAL_TYPE (LaminaWriteGate, lamina_write_gate, LAMINA, WRITE_GATE, GtkBox)

/* A write: runs on the main thread on the window's connection.  FALSE
 * with LAMINA_LIBRARY_ERROR_BUSY keeps it queued (tried again when the
 * lock is free); any other outcome ends it, and the write shows its own
 * result or refusal. */
typedef gboolean (*LaminaWriteFunc) (gpointer   data,
                                     GError   **error);

/* Takes @library's connection to a short wait (LAMINA_BUSY_TIMEOUT from
 * the environment still wins). */
GtkWidget  *lamina_write_gate_new         (LaminaLibrary   *library);
/* Runs @func now, or queues it behind the writes already waiting; @what
 * names it for the banner and for Cancel ("the edits to EW-101"). */
void        lamina_write_gate_run         (LaminaWriteGate *self,
                                           const char      *what,
                                           LaminaWriteFunc  func,
                                           gpointer         data,
                                           GDestroyNotify   data_free);
/* Queues @func without running it first (it was refused as BUSY just
 * now). */
void        lamina_write_gate_queue       (LaminaWriteGate *self,
                                           const char      *what,
                                           LaminaWriteFunc  func,
                                           gpointer         data,
                                           GDestroyNotify   data_free);
gboolean    lamina_write_gate_is_waiting  (LaminaWriteGate *self);
guint       lamina_write_gate_get_n_waiting (LaminaWriteGate *self);
/* The banner's line, or NULL when hidden. */
const char *lamina_write_gate_get_text    (LaminaWriteGate *self);
/* What Cancel does: drops the waiting writes (their data freed unrun) and
 * says which were not written. */
void        lamina_write_gate_cancel      (LaminaWriteGate *self);
/* TRUE if @error is the refusal the gate queues. */
gboolean    lamina_write_gate_is_busy_error (const GError  *error);

G_END_DECLS
