// The node type check (tsc) does not read .vue files; component tests get them as plain components.
declare module '*.vue' {
  import type { DefineComponent } from 'vue';
  const component: DefineComponent;
  export default component;
}
