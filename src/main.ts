import { provideHttpClient, withFetch, withInterceptors } from '@angular/common/http';
import { inject, provideAppInitializer, provideZonelessChangeDetection } from '@angular/core';
import { MAT_FORM_FIELD_DEFAULT_OPTIONS } from '@angular/material/form-field';
import { bootstrapApplication } from '@angular/platform-browser';
import { provideRouter, withComponentInputBinding, withRouterConfig } from '@angular/router';
import { App } from './app/app';
import { appRoutes } from './app/app-routes';
import { AuthSession } from './app/auth/auth-session';
import { unauthorizedInterceptor } from './app/auth/unauthorized-interceptor';
import { ThemePreference } from './app/shell/theme-preference';

bootstrapApplication(App, {
  providers: [
    provideZonelessChangeDetection(),
    provideHttpClient(withFetch(), withInterceptors([unauthorizedInterceptor])),
    // Child pages read :workspaceId as an input, so parameters flow down from the workspace route.
    provideRouter(appRoutes, withComponentInputBinding(), withRouterConfig({ paramsInheritanceStrategy: 'always' })),
    // Guards decide on the user's roles, so the session is known before the first navigation.
    provideAppInitializer(() => inject(AuthSession).restore()),
    provideAppInitializer(() => inject(ThemePreference).apply()),
    // A hint or error under a field takes the lines it needs (styles.scss reserves the first), so a
    // two-line message pushes the next row down instead of running over it.
    { provide: MAT_FORM_FIELD_DEFAULT_OPTIONS, useValue: { subscriptSizing: 'dynamic' } },
  ],
}).catch((failure: unknown) => console.error(failure));
