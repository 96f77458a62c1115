import { signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { ActivatedRouteSnapshot, RedirectCommand, RouterStateSnapshot, convertToParamMap, provideRouter } from '@angular/router';
import type { MeResponse } from '../../../shared/api/auth';
import { AuthSession } from '../auth/auth-session';
import { CurrentWorkspace } from './current-workspace';
import { adminGuard, sectionGuard, workspaceGuard } from './role-guard';

const ME: MeResponse = {
  user: { id: 'u-1', email: 'thermal@kestrel.test', name: 'Thermal Engineer', isAdmin: false },
  workspaces: [
    { workspaceId: 'ws-kestrel', workspaceName: 'Kestrel', role: 'thermal' },
    { workspaceId: 'ws-plover', workspaceName: 'Plover', role: 'owner' },
  ],
  auth: { kind: 'session', readOnly: false },
};

// A route snapshot under /w/:workspaceId, as the router would hand a child's guard.
function routeIn(workspaceId: string): ActivatedRouteSnapshot {
  const parent = { paramMap: convertToParamMap({ workspaceId }) } as ActivatedRouteSnapshot;
  const child = { paramMap: convertToParamMap({}) } as ActivatedRouteSnapshot;
  Object.defineProperty(child, 'pathFromRoot', { value: [parent, child] });
  Object.defineProperty(parent, 'pathFromRoot', { value: [parent] });
  return child;
}

const STATE = { url: '/w/x/members' } as RouterStateSnapshot;

function setUp(me: MeResponse): void {
  const current = signal<MeResponse | null>(me);
  TestBed.configureTestingModule({
    providers: [
      provideRouter([]),
      {
        provide: AuthSession,
        useValue: {
          user: () => current()?.user ?? null,
          workspaces: () => current()?.workspaces ?? [],
          signedIn: () => current() !== null,
        },
      },
    ],
  });
}

function redirectedTo(result: unknown): string | null {
  return result instanceof RedirectCommand ? result.redirectTo.toString() : null;
}

describe('sectionGuard', () => {
  beforeEach(() => localStorage.clear());

  it('lets a thermal engineer open thermal models but shows "not allowed" for members', () => {
    setUp(ME);
    const thermal = TestBed.runInInjectionContext(() => sectionGuard('thermal')(routeIn('ws-kestrel'), STATE));
    const members = TestBed.runInInjectionContext(() => sectionGuard('members')(routeIn('ws-kestrel'), STATE));
    expect(thermal).toBe(true);
    expect(redirectedTo(members)).toBe('/not-allowed');
  });

  it('decides by the role in the workspace of the URL, not the first workspace', () => {
    setUp(ME);
    const members = TestBed.runInInjectionContext(() => sectionGuard('members')(routeIn('ws-plover'), STATE));
    expect(members).toBe(true);
  });

  it('keeps the URL when it turns someone away', () => {
    setUp(ME);
    const result = TestBed.runInInjectionContext(() => sectionGuard('audit')(routeIn('ws-kestrel'), STATE));
    expect(result instanceof RedirectCommand && result.navigationBehaviorOptions?.skipLocationChange).toBe(true);
  });

  it('turns away a workspace the user does not belong to', () => {
    setUp(ME);
    const result = TestBed.runInInjectionContext(() => sectionGuard('cases')(routeIn('ws-other'), STATE));
    expect(redirectedTo(result)).toBe('/not-allowed');
  });
});

describe('workspaceGuard', () => {
  beforeEach(() => localStorage.clear());

  it('makes the workspace of the URL the current one', () => {
    setUp(ME);
    const result = TestBed.runInInjectionContext(() => workspaceGuard(routeIn('ws-plover'), STATE));
    expect(result).toBe(true);
    expect(TestBed.inject(CurrentWorkspace).role()).toBe('owner');
    expect(localStorage.getItem('eclipta.workspace')).toBe('ws-plover');
  });

  it('answers "not found" for a workspace of others, as the server does', () => {
    setUp(ME);
    const result = TestBed.runInInjectionContext(() => workspaceGuard(routeIn('ws-other'), STATE));
    expect(redirectedTo(result)).toBe('/not-found');
    expect(TestBed.inject(CurrentWorkspace).id()).toBe('ws-kestrel');
  });
});

describe('adminGuard', () => {
  it('opens the mail outbox only for an instance administrator', () => {
    setUp(ME);
    expect(redirectedTo(TestBed.runInInjectionContext(() => adminGuard(routeIn('ws-kestrel'), STATE)))).toBe('/not-allowed');
    TestBed.resetTestingModule();
    setUp({ ...ME, user: { ...ME.user, isAdmin: true } });
    expect(TestBed.runInInjectionContext(() => adminGuard(routeIn('ws-kestrel'), STATE))).toBe(true);
  });
});
