/**
 * Input that reaches the canvas before Cytoscape is there (the first view is a picture,
 * StaticView.svelte): the mouse presses, the moves made while a button is down, the releases
 * and the wheel are kept, and replayed to Cytoscape's canvas once it exists, so that the first
 * click, double-click, right-click, drag or zoom acts instead of being lost. Keys need no
 * queue: the canvas runs them on the editor at once (Canvas.svelte defers only what needs the
 * viewport).
 */

interface Kept {
	type: 'mousedown' | 'mousemove' | 'mouseup' | 'wheel';
	init: WheelEventInit;
}

/** A cap on kept events (a long drag over the picture keeps its moves). */
const MAX_KEPT = 2_000;

export class PendingPointer {
	#kept: Kept[] = [];
	#pressed = false;
	#detach: () => void;

	/** Keeps what `container` receives; `onFirst` runs at each press (to start loading Cytoscape). */
	constructor(container: HTMLElement, onFirst: () => void) {
		const keep = (type: Kept['type'], e: MouseEvent) => {
			if (this.#kept.length >= MAX_KEPT) return;
			const init: WheelEventInit = {
				bubbles: true,
				cancelable: true,
				view: window,
				clientX: e.clientX,
				clientY: e.clientY,
				screenX: e.screenX,
				screenY: e.screenY,
				button: e.button,
				buttons: e.buttons,
				shiftKey: e.shiftKey,
				ctrlKey: e.ctrlKey,
				altKey: e.altKey,
				metaKey: e.metaKey
			};
			if (e instanceof WheelEvent) Object.assign(init, { deltaX: e.deltaX, deltaY: e.deltaY, deltaZ: e.deltaZ, deltaMode: e.deltaMode });
			this.#kept.push({ type, init });
		};
		const down = (e: MouseEvent) => {
			onFirst();
			this.#pressed = true;
			keep('mousedown', e);
		};
		const move = (e: MouseEvent) => {
			if (this.#pressed) keep('mousemove', e);
		};
		const up = (e: MouseEvent) => {
			if (!this.#pressed) return;
			this.#pressed = false;
			keep('mouseup', e);
		};
		const wheel = (e: WheelEvent) => {
			onFirst();
			keep('wheel', e);
		};
		container.addEventListener('mousedown', down);
		container.addEventListener('wheel', wheel, { passive: true });
		window.addEventListener('mousemove', move);
		window.addEventListener('mouseup', up);
		this.#detach = () => {
			container.removeEventListener('mousedown', down);
			container.removeEventListener('wheel', wheel);
			window.removeEventListener('mousemove', move);
			window.removeEventListener('mouseup', up);
		};
	}

	/**
	 * Stops keeping and sends what was kept to `target` (an element inside Cytoscape's
	 * container: its handlers accept only events aimed inside it). A press still held goes on
	 * live: the real moves and release reach Cytoscape directly.
	 */
	replay(target: Element): void {
		this.#detach();
		const kept = this.#kept;
		this.#kept = [];
		for (const k of kept) target.dispatchEvent(k.type === 'wheel' ? new WheelEvent('wheel', k.init) : new MouseEvent(k.type, k.init));
	}

	dispose(): void {
		this.#detach();
		this.#kept = [];
	}
}
