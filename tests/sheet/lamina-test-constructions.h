/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-test-constructions.h: build-ups of an invented practice for the
 * sheet tests, built in code.  Design λ from EN ISO 10456:2007 Table 3
 * (generic values, from memory) or typical product values (common
 * practice) where the standard has no generic value. */
#pragma once

#include "lamina-construction.h"

G_BEGIN_DECLS

/* Wall: plaster, aerated concrete block, mineral wool, cavity, brick. */
LaminaConstruction *lamina_test_masonry_wall   (void);
/* Wall: plasterboard, membrane, timber studs with mineral wool, OSB,
 * wood fibre board, ventilated cavity with battens, timber cladding. */
LaminaConstruction *lamina_test_timber_wall    (void);
/* Flat roof: concrete slab, membrane, PIR, bitumen; target U given. */
LaminaConstruction *lamina_test_flat_roof      (void);
/* Ground floor: screed, EPS, concrete; draft. */
LaminaConstruction *lamina_test_ground_floor   (void);
/* Insulation bridged by steel studs: the engine warns (EN ISO 6946:2017
 * clause 1, outside the scope). */
LaminaConstruction *lamina_test_steel_stud_wall (void);

/* All five, in the order above. */
GPtrArray          *lamina_test_constructions  (void);

G_END_DECLS
