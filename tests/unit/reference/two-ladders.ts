/**
 * The 200-variable diagram on which the path listing and the adjustment verdict used to
 * disagree ("0 open" against "50 non-causal paths stay open"): an exposure x and outcome y,
 * 50 confounders c_i (x ← c_i → y: 50 short open back-door paths), and two 50-variable chains
 * a_1 → … → a_50 and b_1 → … → b_50 below x, joined by rungs a_i → b_i (a ladder) and left
 * only through b_1 → k ← y, a collider that blocks every path through them. Those paths are
 * x → a_1 → … → a_j → b_j → … → b_1 → k ← y (50 of them, the longest running both chains),
 * but a plain depth-first search that enters the ladder first (x's first arrow is x → a_1)
 * also walks every zigzag onward from b_j, about 2^50 dead ends. 47 more variables hang below
 * y so the diagram has 200.
 */
export function twoLadderArrows(rungs = 50, confounders = 50, filler = 47): [string, string][] {
	const arrows: [string, string][] = [['x', 'a1']];
	for (let i = 1; i <= rungs; i++) {
		if (i < rungs) arrows.push([`a${i}`, `a${i + 1}`], [`b${i}`, `b${i + 1}`]);
		arrows.push([`a${i}`, `b${i}`]);
	}
	arrows.push(['b1', 'k'], ['y', 'k']);
	for (let i = 1; i <= confounders; i++) arrows.push([`c${i}`, 'x'], [`c${i}`, 'y']);
	for (let i = 1; i <= filler; i++) arrows.push(['y', `d${i}`]);
	return arrows;
}
