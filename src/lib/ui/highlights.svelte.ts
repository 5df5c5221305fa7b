/**
 * What the canvas lights up from the analysis column: one controller for every section.
 * A list item hovered or focused shows its highlight for as long as the pointer or focus stays;
 * a click pins it (a second click on the same item unpins it). The hovered one wins over the
 * pinned one. A pinned highlight belongs to one state of the diagram: any edit clears it.
 */
import { sameHighlight, type Highlight } from './highlight';

export class Highlights {
	/** Kept lit by a click, until another click, Escape or an edit. */
	pinned = $state<Highlight | null>(null);
	/** Lit while the pointer or the focus is on its list item. */
	hovered = $state<Highlight | null>(null);
	/** What the canvas draws. */
	readonly shown = $derived(this.hovered ?? this.pinned);

	/** Something is lit (Escape then clears it rather than doing nothing). */
	get any(): boolean {
		return this.pinned !== null || this.hovered !== null;
	}

	isPinned(h: Highlight): boolean {
		return sameHighlight(this.pinned, h);
	}

	hover = (h: Highlight | null): void => {
		this.hovered = h;
	};

	pin = (h: Highlight | null): void => {
		this.pinned = h;
	};

	/** A click on a list item: pins it, or unpins it when it is the one pinned. */
	toggle = (h: Highlight): void => {
		this.pinned = this.isPinned(h) ? null : h;
	};

	clear = (): void => {
		this.pinned = null;
		this.hovered = null;
	};

	/** An edit: the pinned highlight described the diagram before it. */
	diagramChanged(): void {
		this.pinned = null;
	}
}
