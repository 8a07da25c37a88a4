import { ATTENUATION_TOPIC, LOADING_TOPIC, TERMINATION_TOPIC } from './amplitude-causes';
import { BANDWIDTH_TOPIC, COMPENSATION_TOPIC, GROUND_LEAD_TOPIC } from './edge-causes';
import { AC_COUPLING_TOPIC, ALIASING_TOPIC, CLIPPING_TOPIC } from './acquisition-causes';
import { COMMON_MODE_TOPIC, GENERATOR_LOAD_TOPIC, MAINS_PICKUP_TOPIC } from './reference-causes';
import { ENGINE_TOPIC, SAFETY_TOPIC } from './general';
import type { HelpTopic } from './types';

/** The twelve causes in the engine's order, then the pages that are not causes. */
export const HELP_TOPICS: HelpTopic[] = [
  ATTENUATION_TOPIC,
  TERMINATION_TOPIC,
  LOADING_TOPIC,
  BANDWIDTH_TOPIC,
  COMPENSATION_TOPIC,
  GROUND_LEAD_TOPIC,
  ALIASING_TOPIC,
  CLIPPING_TOPIC,
  AC_COUPLING_TOPIC,
  COMMON_MODE_TOPIC,
  MAINS_PICKUP_TOPIC,
  GENERATOR_LOAD_TOPIC,
  SAFETY_TOPIC,
  ENGINE_TOPIC,
];

export const helpTopic = (slug: string | undefined) => HELP_TOPICS.find((t) => t.slug === slug);
