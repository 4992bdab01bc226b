/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-revision-diff.h: what changed between two revisions of a
 * construction, as sentences for the history window.  No GTK. */
#pragma once

#include "lamina-construction.h"

G_BEGIN_DECLS

/* char* sentences, translated; empty when the content is the same. */
GPtrArray *lamina_revision_diff (const LaminaConstruction *older,
                                 const LaminaConstruction *newer);

G_END_DECLS
