import { computed, onBeforeUnmount, ref, type Ref } from 'vue'

const FRAMES_PER_SECOND = 24

/**
 * Plays a run's frames back at 24 per second (play, pause, scrub); stops at the last frame and when the component
 * goes. `readout` says which moment is shown, so a frame partway through is never taken for the result at the stop.
 */
export function useStillPlayback<F extends { distilledFraction: number }>(frames: Ref<F[]>) {
  const frame = ref(0)
  const playing = ref(false)
  let raf = 0
  let last = 0
  function tick(t: number) {
    if (!playing.value) return
    if (t - last >= 1000 / FRAMES_PER_SECOND) {
      last = t
      if (frame.value >= frames.value.length - 1) return stop()
      frame.value++
    }
    raf = requestAnimationFrame(tick)
  }
  function play() {
    if (!frames.value.length) return
    if (frame.value >= frames.value.length - 1) frame.value = 0
    playing.value = true
    last = 0
    raf = requestAnimationFrame(tick)
  }
  function stop() {
    playing.value = false
    cancelAnimationFrame(raf)
  }
  onBeforeUnmount(stop)

  const now = computed(() => frames.value[frame.value] ?? null)
  const readout = computed(() => {
    const end = frames.value.length - 1
    if (playing.value)
      return {
        key: 'playing',
        text: `Playing back the run: ${((now.value?.distilledFraction ?? 0) * 100).toFixed(0)} % distilled so far, not yet the result.`,
      }
    if (frame.value >= end) return { key: 'end', text: 'End of the run: the read-out is the state at the stop.' }
    return {
      key: 'paused',
      text: `Paused partway (frame ${frame.value + 1} of ${end + 1}); the result at the stop is the last frame.`,
    }
  })
  return { frame, playing, now, readout, play, stop }
}
