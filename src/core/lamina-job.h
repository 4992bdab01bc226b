/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-job.h: a job (a project of the office) and its schedule of
 * constructions.
 *
 * An entry pins a library construction at a revision (normally its
 * approved one).  A job variant is a construction derived from a library
 * one for this job: it lives in the library like any other (so it can be
 * checked and approved), and the entry keeps the link to its origin and
 * the origin's revision, so that the difference can be shown.  Hand-
 * entered linear thermal bridges (ψ·l) may be added to the schedule;
 * nothing else about bridges is assumed.  Moving an entry to another
 * revision is the user's act and is recorded in the job's log. */
#pragma once

#include <glib-object.h>

#include "lamina-construction.h"
#include "lamina-types.h"

G_BEGIN_DECLS

typedef enum
{
  LAMINA_JOB_STATUS_DESIGN,
  LAMINA_JOB_STATUS_SUBMITTED,
  LAMINA_JOB_STATUS_BUILT,
  LAMINA_N_JOB_STATUSES
} LaminaJobStatus;

typedef struct
{
  int     n;                 /* the entry's number in the job, from 1, stable */
  char   *construction;      /* library id */
  int     revision;          /* pinned revision, from 1 */
  char   *use;               /* identifier of a use of the target set */
  char   *location;          /* "north elevation", or NULL */
  double  area;              /* m², NAN if not given */
  char   *origin;            /* a job variant: the construction it came from */
  int     origin_revision;   /* … at this revision (0 if not a variant) */
  int     line;
} LaminaJobEntry;

/* A linear thermal bridge entered by hand: ψ (W/(m·K)) over a length l (m). */
typedef struct
{
  int     n;
  char   *name;
  double  psi;
  double  length;
  int     line;
} LaminaJobJunction;

/* One line of the job's log: who did what and when. */
typedef struct
{
  char *at;                  /* ISO 8601 */
  char *by;
  char *text;
} LaminaJobEvent;

typedef struct
{
  char            *id;
  char            *name;
  char            *number;
  char            *client;
  char            *site;
  char            *architect;
  LaminaJobStatus  status;
  char            *target_set;          /* id, or NULL */
  double           inside_temperature;  /* °C design condition */
  double           outside_temperature;
  char            *climate;             /* id of a climate, or NULL */
  /* Ground floors, EN ISO 13370: the floor's area A (m²) and exposed
   * perimeter P (m), or B′ directly (m); NAN when not given. */
  double           ground_area;
  double           ground_perimeter;
  double           ground_b_prime;
  char            *notes;
  GPtrArray       *entries;             /* LaminaJobEntry*, schedule order */
  GPtrArray       *junctions;           /* LaminaJobJunction* */
  GPtrArray       *log;                 /* LaminaJobEvent*, oldest first */
  char            *modified_at;
  int              line;
} LaminaJob;

#define LAMINA_TYPE_JOB (lamina_job_get_type ())
GType            lamina_job_get_type (void) G_GNUC_CONST;

const char      *lamina_job_status_to_string   (LaminaJobStatus  value);
gboolean         lamina_job_status_from_string (const char      *name,
                                                LaminaJobStatus *value);

LaminaJobEntry  *lamina_job_entry_new   (const char           *construction,
                                         int                   revision,
                                         const char           *use);
LaminaJobEntry  *lamina_job_entry_copy  (const LaminaJobEntry *entry);
void             lamina_job_entry_free  (LaminaJobEntry       *entry);
gboolean         lamina_job_entry_is_variant (const LaminaJobEntry *entry);

LaminaJobJunction *lamina_job_junction_new  (const char              *name,
                                             double                   psi,
                                             double                   length);
LaminaJobJunction *lamina_job_junction_copy (const LaminaJobJunction *junction);
void               lamina_job_junction_free (LaminaJobJunction       *junction);

LaminaJobEvent  *lamina_job_event_new   (const char           *at,
                                         const char           *by,
                                         const char           *text);
void             lamina_job_event_free  (LaminaJobEvent       *event);

LaminaJob       *lamina_job_new         (const char           *id,
                                         const char           *name);
LaminaJob       *lamina_job_copy        (const LaminaJob      *job);
void             lamina_job_free        (LaminaJob            *job);
/* Appends @entry (owned) and gives it the next free number. */
LaminaJobEntry  *lamina_job_add_entry   (LaminaJob            *job,
                                         LaminaJobEntry       *entry);
LaminaJobJunction *lamina_job_add_junction (LaminaJob         *job,
                                            LaminaJobJunction *junction);
LaminaJobEntry  *lamina_job_find_entry  (const LaminaJob      *job,
                                         int                   n);
gboolean         lamina_job_remove_entry (LaminaJob           *job,
                                          int                  n);
gboolean         lamina_job_remove_junction (LaminaJob        *job,
                                             int               n);
/* Moves entry @n to @revision and records it in the log (@at, @by).
 * FALSE if there is no such entry. */
gboolean         lamina_job_move_entry  (LaminaJob            *job,
                                         int                   n,
                                         int                   revision,
                                         const char           *at,
                                         const char           *by);
void             lamina_job_log         (LaminaJob            *job,
                                         const char           *at,
                                         const char           *by,
                                         const char           *text);
/* B′ = A / (0.5 P), EN ISO 13370:2017 8.1 (equation 2); the given B′ when
 * there is one, NAN when neither is given. */
double           lamina_job_get_b_prime (const LaminaJob      *job);
/* Puts @c in the job's design conditions: its inside temperature, its
 * outside one unless @c faces an adjacent indoor space (then the space's
 * stated temperature stays), and, for a floor with the ground, the job's plan (A and
 * P, or B′) in place of the plan the library states.  Given B′ alone,
 * A = B′ and P = 2 m (B′ = A / (0.5 P)): EN ISO 13370's formulas depend
 * on the plan only through B′. */
void             lamina_job_apply_conditions (const LaminaJob    *job,
                                              LaminaConstruction *c);
/* The job's own data and schedule (the log and modified_at aside). */
gboolean         lamina_job_equal       (const LaminaJob      *a,
                                         const LaminaJob      *b);
/* Everything a job must hold to be stored: id, name, entries with a
 * construction id, a revision from 1, a use identifier, an area ≥ 0 and
 * ≤ 10⁶ m²; junctions with ψ from −10 to 10 W/(m·K) and a length ≥ 0;
 * temperatures from −80 to 80 °C.  Names the field and, in @line, the
 * source line. */
gboolean         lamina_job_validate    (const LaminaJob      *job,
                                         int                  *line,
                                         GError              **error);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (LaminaJobEntry, lamina_job_entry_free)
G_DEFINE_AUTOPTR_CLEANUP_FUNC (LaminaJobJunction, lamina_job_junction_free)
G_DEFINE_AUTOPTR_CLEANUP_FUNC (LaminaJob, lamina_job_free)

G_END_DECLS
