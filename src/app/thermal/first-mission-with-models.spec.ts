import { firstValueFrom, of } from 'rxjs';
import { describe, expect, it } from 'vitest';
import { firstMissionWithModels } from './first-mission-with-models';

describe('firstMissionWithModels (common practice, no source)', () => {
  it('answers the first mission with a model and asks no further', async () => {
    const asked: string[] = [];
    const counts: Record<string, number> = { lunar: 0, kestrel: 1, mars: 3 };
    const found = await firstValueFrom(firstMissionWithModels(['lunar', 'kestrel', 'mars'], (id) => {
      asked.push(id);
      return of(counts[id] ?? 0);
    }));
    expect(found).toBe('kestrel');
    expect(asked).toEqual(['lunar', 'kestrel']);
  });

  it('answers null when no mission has a model, and for no missions', async () => {
    expect(await firstValueFrom(firstMissionWithModels(['a', 'b'], () => of(0)))).toBeNull();
    expect(await firstValueFrom(firstMissionWithModels([], () => of(1)))).toBeNull();
  });
});
