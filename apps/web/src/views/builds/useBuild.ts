import type { BuildDetail } from '@busbar/shared';
import { getBuild } from '../../api/builds.ts';
import { recordStateKey, useRecordState, useVersionedRecord, type RecordChange } from '../../composables/useVersionedRecord.ts';

export type BuildChange = RecordChange<BuildDetail>;

const stateKey = recordStateKey('build');

/** The stale notice and reload of the build page, for dialogs that cover the page's own notice. */
export const useBuildState = () => useRecordState(stateKey);

/** One build on screen, changed version by version (see useVersionedRecord). */
export function useBuild(id: () => number) {
  const { record: build, loading, error, failure, stale, load, change } = useVersionedRecord(id, getBuild, stateKey);
  return { build, loading, error, failure, stale, load, change };
}
