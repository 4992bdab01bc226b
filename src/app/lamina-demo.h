/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-demo.h: the demo library (an invented practice's build-ups). */
#pragma once

#include <gio/gio.h>

#include "store/lamina-library.h"

G_BEGIN_DECLS

/* Imports the demo library shipped in the resources into @library. */
gboolean lamina_demo_load (LaminaLibrary  *library,
                           GError        **error);

G_END_DECLS
