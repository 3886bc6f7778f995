// PrimeVue's registry of inserted style sheets, which its package ships without types.
declare module '@primevue/core/base' {
  const Base: { clearLoadedStyleNames(): void };
  export default Base;
}
