import { onBeforeUnmount, onMounted, ref, type Ref } from 'vue';

/**
 * True from the moment `target` comes within `marginPx` of the viewport, and from then on: heavy
 * panels far down a page (the results map) load their code and data only when the reader gets
 * near them. Without IntersectionObserver (old browsers, component tests) it is true at once.
 */
export function useNearViewport(target: Ref<HTMLElement | null>, marginPx = 400): Ref<boolean> {
  const near = ref(false);
  let observer: IntersectionObserver | null = null;
  onMounted(() => {
    if (typeof IntersectionObserver === 'undefined' || !target.value) {
      near.value = true;
      return;
    }
    observer = new IntersectionObserver((seen) => {
      if (!seen.some((e) => e.isIntersecting)) return;
      near.value = true;
      observer?.disconnect();
    }, { rootMargin: `${marginPx}px 0px` });
    observer.observe(target.value);
  });
  onBeforeUnmount(() => observer?.disconnect());
  return near;
}
