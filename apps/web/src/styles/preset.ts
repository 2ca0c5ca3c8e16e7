import { definePreset } from '@primeuix/themes'
import Nora from '@primeuix/themes/nora'

/**
 * Ebullio's own look: a deep "still-glass" teal for actions, a warm amber for highlights,
 * stone-grey surfaces, Inter type and tight 5-px corners.
 */
export const EbullioPreset = definePreset(Nora, {
  primitive: {
    borderRadius: { none: '0', xs: '2px', sm: '3px', md: '5px', lg: '7px', xl: '10px' },
    still: {
      50: '#eef7f7',
      100: '#d3ebec',
      200: '#a9d6d9',
      300: '#76bcc1',
      400: '#4a9ca3',
      500: '#2e8088',
      600: '#216871',
      700: '#1a545c',
      800: '#14434a',
      900: '#0e3238',
      950: '#082126',
    },
    stone: {
      0: '#ffffff',
      50: '#f7f6f3',
      100: '#efede8',
      200: '#e0ddd5',
      300: '#c9c4b8',
      400: '#a39d8f',
      500: '#7f796c',
      600: '#635e53',
      700: '#4b473f',
      800: '#35322c',
      900: '#221f1b',
      950: '#14120f',
    },
  },
  semantic: {
    primary: {
      50: '{still.50}',
      100: '{still.100}',
      200: '{still.200}',
      300: '{still.300}',
      400: '{still.400}',
      500: '{still.500}',
      600: '{still.600}',
      700: '{still.700}',
      800: '{still.800}',
      900: '{still.900}',
      950: '{still.950}',
    },
    colorScheme: {
      light: {
        surface: {
          0: '#ffffff',
          50: '{stone.50}',
          100: '{stone.100}',
          200: '{stone.200}',
          300: '{stone.300}',
          400: '{stone.400}',
          500: '{stone.500}',
          600: '{stone.600}',
          700: '{stone.700}',
          800: '{stone.800}',
          900: '{stone.900}',
          950: '{stone.950}',
        },
        primary: {
          color: '{still.700}',
          contrastColor: '#ffffff',
          hoverColor: '{still.800}',
          activeColor: '{still.900}',
        },
        highlight: {
          background: '{still.50}',
          focusBackground: '{still.100}',
          color: '{still.800}',
          focusColor: '{still.900}',
        },
      },
    },
  },
  // Warnings in dark ink on the light amber (--eb-amber-soft, edged with --eb-amber): the base's white text on
  // mid-yellow falls far short of WCAG AA contrast (4.5:1); ink #221f1b on #fbf1dc is about 15:1.
  components: {
    message: {
      colorScheme: {
        light: {
          warn: {
            background: '#fbf1dc',
            borderColor: '#c98a12',
            color: '#221f1b',
            shadow: 'none',
            closeButton: { hoverBackground: '#f2dfb4', focusRing: { color: '#221f1b', shadow: 'none' } },
            outlined: { color: '#7a5408', borderColor: '#c98a12' },
            simple: { color: '#7a5408' },
          },
        },
      },
    },
    toast: {
      colorScheme: {
        light: {
          warn: {
            background: '#fbf1dc',
            borderColor: '#c98a12',
            color: '#221f1b',
            detailColor: '#221f1b',
            shadow: '{overlay.popover.shadow}',
            closeButton: { hoverBackground: '#f2dfb4', focusRing: { color: '#221f1b', shadow: 'none' } },
          },
        },
      },
    },
  },
})
