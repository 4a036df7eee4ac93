import { MATERIAL_ANIMATIONS } from '@angular/material/core';

/**
 * Providers every console spec gets (angular.json, test target, `providersFile`). jsdom fires no
 * animationend, so Material's dialogs would never report that they closed with animations on.
 */
export default [{ provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } }];
