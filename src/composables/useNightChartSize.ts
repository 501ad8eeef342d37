import { onBeforeUnmount, onMounted, ref, type Ref } from 'vue';

/**
 * The width of an element in CSS pixels, kept up to date with a ResizeObserver, so charts are
 * drawn at their real size (text stays readable on a phone instead of being scaled down).
 */
export function useNightChartSize(element: Ref<HTMLElement | null>, fallbackWidth = 720) {
  const width = ref(fallbackWidth);
  let observer: ResizeObserver | undefined;

  onMounted(() => {
    const el = element.value;
    if (!el) return;
    width.value = Math.max(280, Math.round(el.clientWidth || fallbackWidth));
    if (typeof ResizeObserver === 'undefined') return;
    observer = new ResizeObserver((entries) => {
      const w = entries[0]?.contentRect.width;
      if (w && Math.abs(w - width.value) >= 1) width.value = Math.max(280, Math.round(w));
    });
    observer.observe(el);
  });
  onBeforeUnmount(() => observer?.disconnect());

  return { width };
}
