/**
 * Byrecast's PrimeVue preset: byre green as primary, warm straw-and-slate surfaces, our own
 * dark mode (class `.dark` on <html>).
 */
import { definePreset } from '@primeuix/themes';
import Aura from '@primeuix/themes/aura';

const byreGreen = {
  50: '#eef5f1',
  100: '#d5e7dc',
  200: '#acd0bb',
  300: '#82b597',
  400: '#5e9679',
  500: '#3f6f5a',
  600: '#365f4d',
  700: '#2c4e40',
  800: '#223d32',
  900: '#192d25',
  950: '#0f1c17',
};

const warmSurface = {
  0: '#ffffff',
  50: '#f7f5f0',
  100: '#ece8df',
  200: '#ddd7ca',
  300: '#c7bfae',
  400: '#a59d8c',
  500: '#7f786a',
  600: '#5f5a50',
  700: '#464b4c',
  800: '#323d44',
  900: '#26323a',
  950: '#1a2329',
};

export const ByrecastPreset = definePreset(Aura, {
  primitive: { borderRadius: { sm: '3px', md: '5px', lg: '8px', xl: '12px' } },
  semantic: {
    primary: byreGreen,
    colorScheme: {
      light: {
        surface: warmSurface,
        primary: { color: '{primary.500}', contrastColor: '#ffffff', hoverColor: '{primary.600}', activeColor: '{primary.700}' },
        highlight: { background: '#f6ecd0', focusBackground: '#efdfb0', color: '#26323a', focusColor: '#26323a' },
      },
      dark: {
        surface: {
          0: '#ffffff',
          50: '#e8e4da',
          100: '#cfc9bc',
          200: '#a9a397',
          300: '#878276',
          400: '#676357',
          500: '#4b4e4b',
          600: '#3a444a',
          700: '#2e3a41',
          800: '#243036',
          900: '#1b252b',
          950: '#131b20',
        },
        primary: { color: '{primary.300}', contrastColor: '#0f1c17', hoverColor: '{primary.200}', activeColor: '{primary.100}' },
        highlight: { background: 'rgba(224,182,74,.18)', focusBackground: 'rgba(224,182,74,.28)', color: '#f7f5f0', focusColor: '#f7f5f0' },
      },
    },
  },
});
