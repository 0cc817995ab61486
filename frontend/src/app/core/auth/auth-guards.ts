import { inject } from '@angular/core';
import { CanActivateFn, Router } from '@angular/router';
import type { Capabilities } from '@shared/auth/roles';
import { AuthStore } from './auth-store';

/** Lets signed-in users through; others go to sign-in and come back afterwards. */
export const signedInGuard: CanActivateFn = async (_route, state) => {
  const router = inject(Router);
  const user = await inject(AuthStore)
    .ensureLoaded()
    .catch(() => null);
  return user ? true : router.createUrlTree(['/sign-in'], { queryParams: { returnUrl: state.url } });
};

/** Keeps a signed-in user off the sign-in page. */
export const signedOutGuard: CanActivateFn = async () => {
  const router = inject(Router);
  const user = await inject(AuthStore)
    .ensureLoaded()
    .catch(() => null);
  return user ? router.createUrlTree(['/portfolio']) : true;
};

/** Hides pages a role may not use; the server refuses the requests regardless. */
export function capabilityGuard(capability: keyof Capabilities): CanActivateFn {
  return async () => {
    const store = inject(AuthStore);
    const router = inject(Router);
    await store.ensureLoaded().catch(() => null);
    return store.capabilities()[capability] ? true : router.createUrlTree(['/sites']);
  };
}
