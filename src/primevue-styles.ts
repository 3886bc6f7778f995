/**
 * PrimeVue 4.5 forgets which of its core style sheets are in the page each time any of its
 * components mounts, so every Button or InputText writes the same <style> text again and the
 * browser parses it again: a screen with a few hundred of them spends much of its first draw
 * there. The theme never changes while the app runs (dark mode is a class on <html>), so a
 * sheet once in the page stays right, and forgetting is switched off.
 */
import Base from '@primevue/core/base';

Base.clearLoadedStyleNames = () => undefined;
