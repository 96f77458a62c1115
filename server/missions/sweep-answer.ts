// The mission sweep's answer (GET /missions/:id/orbits/:orbitId/sweep): streamed a chunk of days at
// a time as NDJSON or CSV by default, or all at once as columnar JSON or Arrow (API.md "Answer formats").
import type { Request, Response } from 'express';
import type { z } from 'zod';
import type { sweepQuery } from '../../shared/api/missions';
import type { AppContext } from '../app-context';
import type { MissionRow, OrbitRow } from '../db/schema';
import { answerForm, sendPerStep } from '../http/answer-formats';
import { missionSurfaces } from './saved-environment';
import { planSweep, sweepAssumptions, sweepChunkComputer } from './sweep-days';
import { collectSweep, csvFileName, streamSweep } from './sweep-stream';

export async function sendSweep(ctx: AppContext, req: Request, res: Response, mission: MissionRow, orbit: OrbitRow, query: z.output<typeof sweepQuery>): Promise<void> {
  const plan = planSweep(mission, query);
  const surfaces = missionSurfaces(ctx.db, mission.id, query.properties);
  const form = answerForm(req, query.layout);
  const computeDays = sweepChunkComputer(mission, orbit, plan, surfaces);
  const assumptions = sweepAssumptions(mission, orbit, plan);
  if (form !== 'json') {
    const series = await collectSweep(plan, computeDays);
    const answer = { from: plan.from, to: plan.to, stepDays: plan.stepDays, days: plan.days, properties: query.properties, assumptions, series };
    await sendPerStep(res, form, { answer: () => answer, key: 'series', stepKey: 'date' });
    return;
  }
  await streamSweep({
    res,
    logger: ctx.logger,
    plan,
    surfaces,
    format: query.format,
    fileName: csvFileName(mission.name, orbit.name, 'sweep', plan.from, plan.to, query.properties),
    crewed: mission.crewed,
    computeDays,
    assumptions,
  });
}
