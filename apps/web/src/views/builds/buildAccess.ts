import { BUILD_STATUS_LABELS, BUILD_TRANSITIONS, type AppAbility, type BuildStatus, type BuildView } from '@busbar/shared';
import { subject } from '@casl/ability';

/** The build as a CASL subject; a copy, so the tag never lands on reactive state. */
export function buildSubject(build: BuildView) {
  return subject('Build', { ...build });
}

/** The verb every status button starts with: "Move to Quoted", "Move to Delivered". */
export const moveLabel = (to: BuildStatus) => `Move to ${BUILD_STATUS_LABELS[to]}`;

/** The status changes this person may make on this build now. */
export function transitionsFor(ability: AppAbility, build: BuildView) {
  const target = buildSubject(build);
  return BUILD_TRANSITIONS.filter((t) => t.from === build.status && ability.can(t.action, target));
}

