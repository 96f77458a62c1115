import { type Observable, concatMap, first, from, map } from 'rxjs';

/**
 * The first mission, in list order, that has at least one thermal model, asking one mission at a
 * time and stopping at the first that has; null when none has. The page opens on it when no
 * mission is named in the address, rather than on a mission with nothing to show.
 */
export function firstMissionWithModels(missionIds: readonly string[], modelCount: (missionId: string) => Observable<number>): Observable<string | null> {
  return from(missionIds).pipe(
    concatMap((id) => modelCount(id).pipe(map((n) => (n > 0 ? id : null)))),
    first((id): id is string => id !== null, null),
  );
}
