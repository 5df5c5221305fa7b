/** An item of a context menu (ContextMenu.svelte), as canvas-actions.ts makes them from the actions table. */
export interface MenuItem {
	label: string;
	/** The key that does the same, shown beside the words. */
	shortcut?: string;
	/** Present for on/off items (shown as a check box). */
	checked?: boolean;
	disabled?: boolean;
	run: () => void;
}
