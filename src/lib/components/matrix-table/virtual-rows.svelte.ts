import {
	elementScroll,
	observeElementOffset,
	observeElementRect,
	Virtualizer,
	type VirtualItem,
	type VirtualizerOptions
} from '@tanstack/virtual-core';

export type VirtualRowsOptions = {
	count: number;
	rowHeight_px: number;
	overscan: number;
	scrollElement: HTMLElement | null;
};

export type VirtualRows = {
	readonly items: VirtualItem[];
	/** Height of all rows together, of which only `items` are in the DOM. */
	readonly totalSize_px: number;
	scrollToTop: () => void;
};

/**
 * Windows a long list of fixed-height rows inside a scrolling element. The virtualizer reports
 * scrolls and resizes through `onChange`; copying its window into Svelte state there is what makes
 * the rows re-render. Call during component initialisation: it registers effects.
 */
export function createVirtualRows(options: () => VirtualRowsOptions): VirtualRows {
	let items = $state.raw<VirtualItem[]>([]);
	let totalSize_px = $state(0);

	const publish = (instance: Virtualizer<HTMLElement, HTMLTableRowElement>) => {
		items = instance.getVirtualItems();
		totalSize_px = instance.getTotalSize();
	};

	const configure = (
		given: VirtualRowsOptions
	): VirtualizerOptions<HTMLElement, HTMLTableRowElement> => ({
		count: given.count,
		estimateSize: () => given.rowHeight_px,
		overscan: given.overscan,
		getScrollElement: () => given.scrollElement,
		observeElementRect,
		observeElementOffset,
		scrollToFn: elementScroll,
		onChange: publish
	});

	const virtualizer = new Virtualizer(configure(options()));

	$effect(() => virtualizer._didMount());

	$effect(() => {
		virtualizer.setOptions(configure(options()));
		virtualizer._willUpdate();
		publish(virtualizer);
	});

	return {
		get items() {
			return items;
		},
		get totalSize_px() {
			return totalSize_px;
		},
		scrollToTop: () => virtualizer.scrollToOffset(0)
	};
}
