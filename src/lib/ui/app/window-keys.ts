/** The window's key handler: the app actions table (actions/app-actions.ts) over the app's parts. */
import { runWindowKey, type AppContext } from '../actions/app-actions';

function inTextField(t: EventTarget | null): boolean {
	const el = t as HTMLElement | null;
	return !!el && (el.tagName === 'INPUT' || el.tagName === 'TEXTAREA' || el.tagName === 'SELECT' || el.isContentEditable);
}

/** `context` is read at each key press, so it sees the app's state of that moment. */
export function windowKeyHandler(context: () => AppContext): (e: KeyboardEvent) => void {
	return (e) => runWindowKey(e, inTextField(e.target), context());
}
