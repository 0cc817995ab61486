import { provideHttpClient, withInterceptors, withXsrfConfiguration } from '@angular/common/http';
import { ApplicationConfig, inject, provideAppInitializer, provideBrowserGlobalErrorListeners } from '@angular/core';
import { MatIconRegistry } from '@angular/material/icon';
import { provideRouter, withComponentInputBinding, withRouterConfig } from '@angular/router';
import { routes } from './app.routes';
import { csrfInterceptor } from './core/http/csrf-interceptor';
import { unauthorizedInterceptor } from './core/http/unauthorized-interceptor';

export const appConfig: ApplicationConfig = {
  providers: [
    // Zoneless change detection is Angular 21's default: no provider and no zone.js needed.
    provideBrowserGlobalErrorListeners(),
    // Pages inside a site's workspace (/sites/:id/...) read the parent's :id as their own input.
    provideRouter(routes, withComponentInputBinding(), withRouterConfig({ paramsInheritanceStrategy: 'always' })),
    provideHttpClient(
      withInterceptors([csrfInterceptor, unauthorizedInterceptor]),
      withXsrfConfiguration({ cookieName: 'XSRF-TOKEN', headerName: 'X-XSRF-TOKEN' }),
    ),
    // Icons come from the self-hosted Material Symbols font (see styles.scss), not the legacy icon font.
    provideAppInitializer(() => {
      inject(MatIconRegistry).setDefaultFontSetClass('material-symbols-outlined');
    }),
  ],
};
