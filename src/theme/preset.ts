import { definePreset } from '@primeuix/themes';
import Nora from '@primeuix/themes/nora';
import { amber, caution, fern, graphite, steel } from './palettes';

/**
 * Tallyvolt's own look over the Nora base. The base components pick their warn and danger colours
 * from the orange, yellow and red primitives, so those are replaced with our amber and caution red:
 * every severity then follows our palette without per-component overrides. Nora already sets dark
 * text on warn buttons, which white on amber would need.
 */
export const tallyvoltPreset = definePreset(Nora, {
  primitive: {
    borderRadius: { none: '0', xs: '2px', sm: '3px', md: '4px', lg: '6px', xl: '8px' },
    red: caution,
    orange: amber,
    yellow: amber,
    amber,
    // Success tags and toasts: our green, with contrast for small text.
    green: fern,
    emerald: fern,
    // Info toasts and tags draw on blue and sky; steel keeps them in the family of the primary.
    blue: steel,
    sky: steel,
  },
  semantic: {
    primary: steel,
    focusRing: { width: '2px', style: 'solid', color: '{primary.400}', offset: '2px' },
    colorScheme: {
      light: {
        surface: graphite,
        primary: {
          color: '{primary.500}',
          contrastColor: '#ffffff',
          hoverColor: '{primary.600}',
          activeColor: '{primary.700}',
        },
        highlight: {
          background: '{primary.50}',
          focusBackground: '{primary.100}',
          color: '{primary.800}',
          focusColor: '{primary.900}',
        },
        text: {
          color: '{surface.800}',
          hoverColor: '{surface.900}',
          mutedColor: '{surface.600}',
          hoverMutedColor: '{surface.700}',
        },
      },
    },
  },
  components: {
    // Nora's solid dark error panel shouts; a pale wash with a red rule reads as "fix this" instead.
    message: {
      colorScheme: {
        light: {
          error: {
            background: '{red.50}',
            borderColor: '{red.500}',
            color: '{red.700}',
            closeButton: { hoverBackground: '{red.100}', focusRing: { color: '{red.500}', shadow: 'none' } },
          },
        },
      },
    },
  },
});
