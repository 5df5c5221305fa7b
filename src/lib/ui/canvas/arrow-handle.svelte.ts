/**
 * Drawing an arrow with the mouse: a ➜ handle beside the hovered variable; dragging it runs
 * the cytoscape-edgehandles gesture (snapping, preview), which pointer-events.ts completes.
 */
import type { Core, NodeSingular } from 'cytoscape';
import type { EdgeHandles } from './edgehandles';
import { nodeKey } from './elements';
import type { Viewport } from './viewport';

export class ArrowHandle {
	/** Where the handle is shown, in canvas pixels, and for which variable. */
	at = $state<{ id: string; left: number; top: number } | null>(null);
	#drawing = false;
	#hideTimer: ReturnType<typeof setTimeout> | null = null;
	#hoverFrame = 0;

	constructor(
		private readonly cy: Core,
		private readonly eh: EdgeHandles,
		private readonly view: Viewport,
		private readonly container: HTMLElement,
		/** The handle stays hidden while a name is being typed. */
		private readonly paused: () => boolean
	) {}

	show(id: string): void {
		this.#clearTimer();
		const n = this.cy.getElementById(nodeKey(id));
		if (n.empty() || this.paused()) return;
		const bb = n.renderedBoundingBox({ includeLabels: false, includeOverlays: false });
		this.at = { id, left: bb.x2 - 4, top: (bb.y1 + bb.y2) / 2 };
	}

	hide(): void {
		this.at = null;
	}

	/** After the viewport moved, the handle follows its variable. */
	follow(): void {
		if (this.at) this.show(this.at.id);
	}

	/**
	 * Which variable the pointer is over, by the nodes' drawn boxes (O(n) per animation frame).
	 * Done here rather than with Cytoscape's hover events, which stop after a gesture that
	 * began outside the canvas (as drawing from the handle does).
	 */
	onPointerMove(e: PointerEvent): void {
		if ((e.target as HTMLElement).classList?.contains('arrow-handle')) {
			this.#clearTimer();
			return;
		}
		if (this.#drawing || e.buttons !== 0 || this.#hoverFrame) return;
		const { clientX, clientY } = e;
		this.#hoverFrame = requestAnimationFrame(() => {
			this.#hoverFrame = 0;
			if (this.#drawing) return;
			const r = this.container.getBoundingClientRect();
			const x = clientX - r.left;
			const y = clientY - r.top;
			let over: string | null = null;
			this.cy.nodes('[vid]').forEach((n) => {
				const bb = n.renderedBoundingBox({ includeLabels: false, includeOverlays: false });
				if (x >= bb.x1 && x <= bb.x2 && y >= bb.y1 && y <= bb.y2) over = n.data('vid') as string;
			});
			if (over) this.show(over);
			else if (this.at) this.scheduleHide();
		});
	}

	/** Keeps the handle while the pointer is on it. */
	onEnter(): void {
		this.#clearTimer();
	}

	scheduleHide(): void {
		this.#clearTimer();
		this.#hideTimer = setTimeout(() => {
			if (!this.#drawing) this.at = null;
		}, 600);
	}

	onPointerDown(e: PointerEvent): void {
		const at = this.at;
		if (!at || e.button !== 0) return;
		e.preventDefault();
		e.stopPropagation();
		const { eh, view } = this;
		this.#drawing = true;
		eh.start(this.cy.getElementById(nodeKey(at.id)) as NodeSingular);
		eh.update(view.toModel(e.clientX, e.clientY));
		const move = (ev: PointerEvent) => eh.update(view.toModel(ev.clientX, ev.clientY));
		const up = (ev: PointerEvent) => {
			window.removeEventListener('pointermove', move);
			window.removeEventListener('pointerup', up);
			eh.update(view.toModel(ev.clientX, ev.clientY));
			eh.snap();
			eh.stop();
			this.#drawing = false;
			this.at = null;
		};
		window.addEventListener('pointermove', move);
		window.addEventListener('pointerup', up);
	}

	#clearTimer(): void {
		if (this.#hideTimer) clearTimeout(this.#hideTimer);
	}
}
