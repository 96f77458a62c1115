// The thermal work done off the request thread (server/thermal/thermal-pool.ts runs it in worker
// threads): pure calls into shared/physics, their inputs and answers plain data (structured clone).
// Failures cross the thread as plain objects and are rebuilt as the same error classes, so the
// routes' mapping to 4xx answers (thermal-failures.ts, errors.ts) is the one it was on the main thread.
import { ConvergenceError, PhysicsError } from '../../shared/physics/physics-error';
import { ThermalConvergenceError, ThermalModelError, type ThermalSolveInput } from '../../shared/physics/thermal-model';
import { distancePoint } from '../../shared/physics/thermal-distance-study';
import { heaterPowerFor, radiatorAreaFor } from '../../shared/physics/thermal-sizing';
import { solveThermal } from '../../shared/physics/thermal-solver';

export const thermalTasks = {
  solve: (model: ThermalSolveInput) => solveThermal(model),
  radiator: ({ model, node, marginK }: { model: ThermalSolveInput; node: string; marginK: number }) => radiatorAreaFor(model, node, marginK),
  heater: ({ model, node, marginK, maxDutyCycle }: { model: ThermalSolveInput; node: string; marginK: number; maxDutyCycle?: number }) =>
    heaterPowerFor(model, node, marginK, maxDutyCycle),
  distancePoint: ({ model, node, marginK }: { model: ThermalSolveInput; node: string; marginK: number }) => distancePoint(model, node, marginK),
};

export type ThermalTasks = typeof thermalTasks;
export type ThermalTaskName = keyof ThermalTasks;

/** A failure as it crosses the thread. */
export type TaskFailure =
  | { kind: 'thermal_convergence'; message: string; orbits: number; residualK: number; path?: string }
  | { kind: 'thermal_model'; message: string; path: string }
  | { kind: 'physics'; message: string; code: PhysicsError['code']; details: PhysicsError['details'] }
  | { kind: 'convergence'; message: string; solver: string }
  | { kind: 'other'; message: string; name: string; stack?: string };

export function describeFailure(error: unknown): TaskFailure {
  if (error instanceof ThermalConvergenceError) {
    return { kind: 'thermal_convergence', message: error.message, orbits: error.orbits, residualK: error.residualK, ...(error.path !== undefined ? { path: error.path } : {}) };
  }
  if (error instanceof ThermalModelError) return { kind: 'thermal_model', message: error.message, path: error.path };
  if (error instanceof PhysicsError) return { kind: 'physics', message: error.message, code: error.code, details: error.details };
  if (error instanceof ConvergenceError) return { kind: 'convergence', message: error.message, solver: error.solver };
  if (error instanceof Error) return { kind: 'other', message: error.message, name: error.name, ...(error.stack ? { stack: error.stack } : {}) };
  return { kind: 'other', message: String(error), name: 'Error' };
}

export function rebuildFailure(failure: TaskFailure): Error {
  switch (failure.kind) {
    case 'thermal_convergence':
      return new ThermalConvergenceError(failure.message, failure.orbits, failure.residualK, failure.path);
    case 'thermal_model':
      return new ThermalModelError(failure.message, failure.path);
    case 'physics':
      return new PhysicsError(failure.code, failure.message, failure.details);
    case 'convergence': {
      const error = new ConvergenceError(failure.solver, '');
      error.message = failure.message;
      return error;
    }
    default: {
      const error = new Error(failure.message);
      error.name = failure.name;
      if (failure.stack) error.stack = failure.stack;
      return error;
    }
  }
}
