/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-job-check.h: a job's schedule checked against its target set.
 *
 * Pure: the caller hands in, for each entry, the construction it pins and
 * its result (calculated in the job's design conditions) and what the
 * library knows about it (a newer approved revision, changed material
 * data); the check gives each entry its target, verdict, U·A and flags,
 * the area-weighted mean U per element kind and H_T.  H_T here is the
 * transmission heat-loss coefficient of the listed elements' fabric only
 * (Σ U·A, W/K); hand-entered ψ·l are summed beside it, never hidden in it. */
#pragma once

#include "lamina-calc.h"
#include "lamina-construction.h"
#include "lamina-job.h"
#include "lamina-moisture.h"
#include "lamina-target-set.h"

G_BEGIN_DECLS

typedef enum
{
  LAMINA_VERDICT_MET,            /* U (and fRsi, if asked) within the target */
  LAMINA_VERDICT_NOT_MET,
  LAMINA_VERDICT_NO_TARGET,      /* the job has no target for this use */
  LAMINA_VERDICT_NOT_CALCULATED, /* missing construction, or U not calculable */
  LAMINA_N_VERDICTS
} LaminaVerdict;

typedef enum
{
  LAMINA_ENTRY_NONE             = 0,
  LAMINA_ENTRY_NOT_APPROVED     = 1 << 0, /* the pinned revision is not approved */
  LAMINA_ENTRY_NEWER_APPROVED   = 1 << 1, /* a newer approved revision exists */
  LAMINA_ENTRY_MATERIAL_CHANGED = 1 << 2, /* library material data changed since */
  LAMINA_ENTRY_OUT_OF_SCOPE     = 1 << 3, /* the target needs a method not applied */
  LAMINA_ENTRY_WRONG_ELEMENT    = 1 << 4, /* not the element kind the use is for */
  LAMINA_ENTRY_FRSI_NOT_MET     = 1 << 5,
  LAMINA_ENTRY_MOISTURE_OPEN    = 1 << 6, /* moisture criterion not assessed here */
  LAMINA_ENTRY_WARNINGS         = 1 << 7, /* the calculation gave warnings */
  LAMINA_ENTRY_MISSING          = 1 << 8, /* the construction or revision is gone */
  LAMINA_ENTRY_MOISTURE_NOT_MET = 1 << 9, /* the moisture criterion assessed and failed */
  LAMINA_ENTRY_CLIMATE_CHANGED  = 1 << 10, /* library climate data changed since */
} LaminaEntryFlags;

/* What the caller knows about one entry. */
typedef struct
{
  const LaminaConstruction *construction;   /* NULL if missing */
  const LaminaResult       *result;         /* NULL if not calculable */
  LaminaEntryFlags          flags;          /* NEWER_APPROVED, MATERIAL_CHANGED, MISSING */
  int                       newer_revision; /* with NEWER_APPROVED */
  /* EN ISO 13788 in the job's climate (NULL if not assessed) and, when
   * it could not be, why (a sentence, or NULL). */
  const LaminaMoistureResult *moisture;
  const char               *moisture_problem;
} LaminaJobInput;

typedef struct
{
  const LaminaJobEntry     *entry;          /* borrowed from the job */
  const LaminaConstruction *construction;   /* borrowed from the input */
  const LaminaTarget       *target;         /* borrowed from the set, or NULL */
  double                    u;              /* lamina_job_result_u, W/(m²·K), or NAN */
  double                    max_u;          /* NAN without a target */
  double                    frsi;           /* 1 − Rsi·U, NAN if not calculated */
  double                    ua;             /* W/K, NAN without an area */
  LaminaVerdict             verdict;
  LaminaEntryFlags          flags;
  int                       newer_revision;
  GPtrArray                *notes;          /* char*: one sentence per flag */
  /* The target's moisture criterion: MET / NOT_MET when assessed,
   * NO_TARGET when the target asks none, NOT_CALCULATED when it asks one
   * that could not be assessed. */
  LaminaVerdict             moisture_verdict;
  const LaminaMoistureResult *moisture;     /* borrowed from the input */
} LaminaJobLine;

typedef struct
{
  double area;     /* m² with a U */
  double ua;       /* W/K */
  double mean_u;   /* Σ U·A / Σ A, NAN without areas */
} LaminaKindTotal;

typedef struct
{
  GPtrArray       *lines;          /* LaminaJobLine*, schedule order */
  LaminaKindTotal  kinds[LAMINA_N_ELEMENTS];
  double           area;           /* Σ A of entries with an area and a U */
  double           h_t;            /* Σ U·A over those entries, W/K */
  double           h_junctions;    /* Σ ψ·l of the hand-entered junctions, W/K */
  double           h_total;        /* h_t + h_junctions */
  guint            n_met;
  guint            n_not_met;
  guint            n_open;         /* no target or not calculated */
  guint            n_flagged;      /* entries with any flag */
} LaminaJobCheck;

/* The surface resistance for the temperature factor, EN ISO 13788:2012
 * 4.2 (0.25 m²·K/W on the inside of opaque elements; from memory). */
#define LAMINA_FRSI_SURFACE_RESISTANCE 0.25

/* Whether @result meets @criterion: no interstitial condensation in any
 * month, or all condensate evaporated by the end of the year
 * (EN ISO 13788:2012 clause 7, the monthly balance). */
gboolean        lamina_moisture_criterion_met (LaminaMoistureCriterion     criterion,
                                               const LaminaMoistureResult *result);

/* One sentence with the entry's fRsi and moisture criterion against its
 * target, pass or fail ("EN ISO 13788: fRsi 0.94 ≥ 0.75 met; no
 * condensation: met …"); NULL when the target asks neither. */
char           *lamina_job_line_dup_moisture_text (const LaminaJobLine *line);
/* The same criteria without the standard's name and the accumulation
 * ("fRsi 0.94, minimum 0.75: met; …"), for a sheet whose own EN ISO 13788
 * line gives both. */
char           *lamina_job_line_dup_criteria_text (const LaminaJobLine *line);

/* @inputs holds one LaminaJobInput per entry of @job, in order; @targets
 * may be NULL (then nothing has a target). */
LaminaJobCheck *lamina_job_check       (const LaminaJob       *job,
                                        const LaminaTargetSet *targets,
                                        const LaminaJobInput  *inputs,
                                        guint                  n_inputs);
void            lamina_job_check_free  (LaminaJobCheck        *check);
const char     *lamina_verdict_to_string (LaminaVerdict        verdict);
/* The U the job checks for @result, as its sheet prints it: the floor's
 * U with the ground (EN ISO 13370) when it states its ground, else the
 * corrected U (EN ISO 6946 with Annex F). */
double          lamina_job_result_u    (const LaminaResult    *result);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (LaminaJobCheck, lamina_job_check_free)

G_END_DECLS
