// Charts draw in the browser only; every chart sits inside <ClientOnly> with a text alternative.
// The library loads when the first chart mounts, not with every page.
export default defineNuxtPlugin((nuxtApp) => {
  nuxtApp.vueApp.component('apexchart', defineAsyncComponent(() => import('vue3-apexcharts')))
})
