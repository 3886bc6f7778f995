/**
 * The app's light or dark theme as the chart library needs it: whether `.dark` is on <html> (set
 * by the top bar's toggle) and the text, muted and border colours of that theme, read from the
 * CSS variables in src/assets/main.css so charts use the same palette as the page.
 */
import { onBeforeUnmount, readonly, ref } from 'vue';

export interface AppThemeColours {
  dark: boolean;
  text: string;
  muted: string;
  border: string;
}

function read(): AppThemeColours {
  const root = document.documentElement;
  const style = getComputedStyle(root);
  const dark = root.classList.contains('dark');
  const css = (name: string, fallback: string): string => style.getPropertyValue(name).trim() || fallback;
  return {
    dark,
    text: css('--by-text', dark ? '#ece8df' : '#26323a'),
    muted: css('--by-muted', dark ? '#a9b2b8' : '#5c6670'),
    border: css('--by-border', dark ? '#33424a' : '#ddd7ca'),
  };
}

/** The current theme's colours, renewed when the theme is toggled. */
export function useAppTheme() {
  const colours = ref<AppThemeColours>(read());
  const observer = new MutationObserver(() => {
    colours.value = read();
  });
  observer.observe(document.documentElement, { attributes: true, attributeFilter: ['class'] });
  onBeforeUnmount(() => observer.disconnect());
  return readonly(colours);
}
