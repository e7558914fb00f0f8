import VueApexCharts from 'vue3-apexcharts'

// Charts draw in the browser only; every chart sits inside <ClientOnly> with a text alternative.
export default defineNuxtPlugin((nuxtApp) => {
  nuxtApp.vueApp.use(VueApexCharts)
})
