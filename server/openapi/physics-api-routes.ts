// The stateless physics helpers beyond the compute route, and the thermal solver
// (shared/api/environment.ts, shared/api/thermal.ts).
import {
  betaHistoryRequest, betaHistoryResponse, bodyDetail, orbitFiguresRequest, orbitFiguresResponse, sunSynchronousQuery, sunSynchronousResponse,
  unitConvertRequest, unitConvertResponse,
} from '../../shared/api/environment';
import { thermalSizeRequest, thermalSizeResponse, thermalSolveRequest, thermalSolveResponse } from '../../shared/api/thermal';
import type { ApiRoute } from './api-route';

const v1 = '/api/v1';

export const physicsApiRoutes: ApiRoute[] = [
  { method: 'get', path: `${v1}/bodies/:bodyId`, tag: 'environment', summary: 'One body with its sources', response: bodyDetail },
  { method: 'get', path: `${v1}/bodies/:bodyId/sun-synchronous`, tag: 'environment', summary: 'The sun-synchronous inclination for an altitude (422 where none exists)', query: sunSynchronousQuery, response: sunSynchronousResponse },
  { method: 'post', path: `${v1}/orbits/figures`, tag: 'environment', summary: 'Period, mean motion, J2 drift and speeds of an orbit', body: orbitFiguresRequest, response: orbitFiguresResponse },
  { method: 'post', path: `${v1}/environment/beta-history`, tag: 'environment', summary: 'Beta, eclipse and Sun distance over a date range', body: betaHistoryRequest, response: betaHistoryResponse },
  { method: 'post', path: `${v1}/units/convert`, tag: 'environment', summary: 'Read a value with its unit in the unit asked for', body: unitConvertRequest, response: unitConvertResponse },
  { method: 'post', path: `${v1}/thermal/solve`, tag: 'thermal', summary: 'A lumped-node model at periodic steady state (422 when it does not converge)', body: thermalSolveRequest, response: thermalSolveResponse },
  { method: 'post', path: `${v1}/thermal/size`, tag: 'thermal', summary: 'Radiator area for the hot case or heater power for the cold case', body: thermalSizeRequest, response: thermalSizeResponse },
];
