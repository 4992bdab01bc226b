/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-target-set.h: a named table of requirements per use of an element
 * (the maximum U of an external wall, a roof, a floor to the ground …),
 * entered by the office from the code that applies to its jobs.  Lamina
 * ships no regulation's values. */
#pragma once

#include <glib-object.h>

#include "lamina-types.h"

G_BEGIN_DECLS

/* Moisture criterion of a use (EN ISO 13788). */
typedef enum
{
  LAMINA_MOISTURE_NONE,            /* none asked */
  LAMINA_MOISTURE_NO_CONDENSATION, /* no interstitial condensation in any month */
  LAMINA_MOISTURE_NO_ACCUMULATION, /* condensate evaporates within the year */
  LAMINA_N_MOISTURE_CRITERIA
} LaminaMoistureCriterion;

typedef struct
{
  char                    *use;       /* identifier: external-wall, roof … */
  char                    *label;     /* a name for people, or NULL */
  int                      element;   /* LaminaElement the use is for, or -1 */
  double                   max_u;     /* W/(m²·K) */
  double                   min_frsi;  /* temperature factor, NAN if none */
  LaminaMoistureCriterion  moisture;
  /* The requirement is for the U of a floor including the ground
   * (EN ISO 13370), not the construction's U alone (EN ISO 6946). */
  gboolean                 ground;
  int                      line;
} LaminaTarget;

typedef struct
{
  char      *id;
  char      *name;
  char      *source;   /* where the values come from (the code, its clause) */
  char      *notes;
  GPtrArray *targets;  /* LaminaTarget*, in table order */
  int        line;
} LaminaTargetSet;

#define LAMINA_TYPE_TARGET_SET (lamina_target_set_get_type ())
GType            lamina_target_set_get_type (void) G_GNUC_CONST;

const char      *lamina_moisture_criterion_to_string   (LaminaMoistureCriterion  value);
gboolean         lamina_moisture_criterion_from_string (const char              *name,
                                                        LaminaMoistureCriterion *value);

LaminaTarget    *lamina_target_new      (const char            *use,
                                         double                 max_u);
LaminaTarget    *lamina_target_copy     (const LaminaTarget    *target);
void             lamina_target_free     (LaminaTarget          *target);

LaminaTargetSet *lamina_target_set_new  (const char            *id,
                                         const char            *name);
LaminaTargetSet *lamina_target_set_copy (const LaminaTargetSet *set);
void             lamina_target_set_free (LaminaTargetSet       *set);
/* Takes ownership of @target. */
void             lamina_target_set_add  (LaminaTargetSet       *set,
                                         LaminaTarget          *target);
/* The target for @use, or NULL. */
const LaminaTarget *lamina_target_set_find (const LaminaTargetSet *set,
                                            const char            *use);
gboolean         lamina_target_set_equal (const LaminaTargetSet *a,
                                          const LaminaTargetSet *b);
/* Ids and uses are identifiers, each use once, every max-u above 0 and
 * at most 10, every fRsi from 0 to 1; names the target of the first fault
 * (LAMINA_CALC_ERROR_INVALID) and its source line in @line. */
gboolean         lamina_target_set_validate (const LaminaTargetSet *set,
                                             int                   *line,
                                             GError               **error);
/* TRUE if @text is a usable identifier (no blanks, 1–200 bytes). */
gboolean         lamina_identifier_is_valid (const char *text);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (LaminaTarget, lamina_target_free)
G_DEFINE_AUTOPTR_CLEANUP_FUNC (LaminaTargetSet, lamina_target_set_free)

G_END_DECLS
