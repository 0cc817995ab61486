import { Provider } from '@angular/core';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { provideEchartsCore } from 'ngx-echarts';

// Providers every component test gets (the unit-test builder's `providersFile`).
const providers: Provider[] = [
  // Animations off, so harnesses never wait for transitions.
  { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
  // Chart widgets need the config token; echarts stays a lazy import, as in the app.
  // With a renderer registered, so a chart that renders during a test (jsdom: SVG, no canvas) doesn't throw.
  provideEchartsCore({
    echarts: async () => {
      const [core, renderers] = await Promise.all([import('echarts/core'), import('echarts/renderers')]);
      core.use([renderers.SVGRenderer]);
      return core;
    },
  }),
];

export default providers;
