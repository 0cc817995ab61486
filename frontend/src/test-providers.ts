import { Provider } from '@angular/core';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { provideEchartsCore } from 'ngx-echarts';

// Providers every component test gets (the unit-test builder's `providersFile`).
const providers: Provider[] = [
  // Animations off, so harnesses never wait for transitions.
  { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
  // Chart widgets need the config token; echarts stays a lazy import, as in the app.
  provideEchartsCore({ echarts: () => import('echarts/core') }),
];

export default providers;
