// The distance study of a saved model (shared/physics/thermal-distance-study.ts): checked and
// planned on the request thread, then one distance at a time in the thermal pool, each written as
// an NDJSON line as soon as it is done (the page's progress bar). A client that leaves stops it:
// the running distance's worker is ended and no further distance is started.
import type { Response } from 'express';
import type { z } from 'zod';
import type { DistanceStudyLine, thermalDistanceStudyRequest } from '../../shared/api/thermal-models';
import { bodyDistances, perihelionAphelion, solarScaleAt, type StudyDistance } from '../../shared/physics/thermal-distance-study';
import { round } from '../../shared/physics/rounding';
import { solarFluxWm2 } from '../../shared/physics/sun';
import type { Db } from '../db/database';
import { badRequest } from '../errors';
import type { Logger } from '../logger';
import { caseOfMission, modelFor } from './thermal-model-access';
import { caseRef, inputsFor } from './thermal-model-runs';
import { thermalPool, whileClientWaits } from './thermal-pool';

type StudyRequest = z.output<typeof thermalDistanceStudyRequest>;

const ndjson = (line: DistanceStudyLine): string => JSON.stringify(line) + '\n';

export async function streamDistanceStudy(db: Db, logger: Logger, userId: string, modelId: string, body: StudyRequest, res: Response): Promise<void> {
  const { row, mission, role } = modelFor(db, userId, modelId, 'run');
  const loadCase = caseOfMission(db, mission, body.caseId, role, 'caseId');
  if (!row.model.nodes.some((n) => n.name === body.node)) {
    const message = `no node is named ${JSON.stringify(body.node)} in model "${row.name}"`;
    throw badRequest(`node: ${message}.`, [{ path: 'node', message }]);
  }
  const distances: StudyDistance[] = [
    ...(body.missionRange ? perihelionAphelion(mission.bodyId) : []),
    ...(body.bodyIds ?? []).flatMap(bodyDistances),
    ...(body.distancesAu ?? []).map((d) => ({ label: `${d} AU`, distanceAu: d })),
  ].sort((a, b) => a.distanceAu - b.distanceAu);
  const caseFlux = loadCase.results.solarFluxWm2;
  // Every distance's model is checked (and bounded) before the answer begins, so a refusal is a 4xx.
  const plans = distances.map((d) => {
    const solarScale = solarScaleAt(d.distanceAu, caseFlux);
    return { ...d, solarScale, inputs: inputsFor(db, row, mission, loadCase, {}, solarScale) };
  });
  const first = plans[0]?.inputs;
  const marginK = body.marginK ?? first?.parsed.margins?.operatingK ?? 0;

  const signal = whileClientWaits(res);
  res.status(200).set('Cache-Control', 'no-store').type('application/x-ndjson; charset=utf-8');
  res.write(ndjson({
    type: 'start',
    model: { id: row.id, name: row.name },
    case: { ...caseRef(loadCase), solarFluxWm2: caseFlux },
    node: body.node,
    marginK,
    distances,
    assumptions: [
      ...(first?.assumptions ?? []),
      `The case's solar and albedo loads are scaled by the solar flux at each distance over the case's ${round(caseFlux, 1)} W/m² (inverse square, 1361 W/m² at 1 AU); planetary IR is kept as in the case.`,
      'Pump flow is what the loops\' controllers settle to at each distance; the radiator is sized on its own to hold the node\'s maximum less the margin.',
    ],
  }));
  res.flush?.();
  const stopped = (done: number) => logger.info('distance study stopped: the client left', { done, distances: plans.length });
  for (const [index, plan] of plans.entries()) {
    if (signal.aborted) {
      stopped(index);
      return;
    }
    try {
      const point = await thermalPool.run('distancePoint', { model: plan.inputs.parsed, node: body.node, marginK }, signal);
      res.write(ndjson({ type: 'point', index, label: plan.label, distanceAu: round(plan.distanceAu, 6), solarFluxWm2: round(solarFluxWm2(plan.distanceAu), 3), solarScale: round(plan.solarScale, 6), ...point }));
      res.flush?.();
    } catch (error) {
      if (signal.aborted) {
        stopped(index);
        return;
      }
      // The 200 and part of the answer are out; the failure can only be told in the stream.
      logger.error('distance study failed', { error: error instanceof Error ? error : String(error), distanceAu: plan.distanceAu });
      res.end(ndjson({ type: 'error', message: `The study failed on the server at ${plan.label}; the error was logged.` }));
      return;
    }
  }
  res.end(ndjson({ type: 'end', points: plans.length }));
}
