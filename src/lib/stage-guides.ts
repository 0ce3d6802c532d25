/**
 * The built-in guide that explains each plant stage, so every stage a page names (the plant's
 * own stage, the chart's legend) can link to it. A link to a built-in guide follows the owner's
 * published replacement (/guides/[slug] redirects), so the nursery's own words show here too.
 * Kept apart from the guide library ($lib/guides) so the browser does not load every guide's text;
 * tests/unit/guides/guides.test.ts checks each slug exists and is filed under its stage.
 */
import type { PlantStage } from './care';

export const GUIDE_FOR_STAGE: Readonly<Record<PlantStage, string>> = {
	planted: 'planting',
	'growing-leaves': 'feeding',
	'followers-out': 'followers-and-thinning',
	flowering: 'flowering',
	ready: 'harvest',
	'cut-back': 'after-harvest',
	// No guide of their own: handing a mat on is the end of the after-harvest work, and a lost stem's
	// mat goes on through the follower the follower guide explains how to choose.
	'handed-on': 'after-harvest',
	lost: 'followers-and-thinning'
};

/** Stages whose guide is filed under another stage (they have none of their own). */
export const BORROWED_STAGE_GUIDES: readonly PlantStage[] = ['handed-on', 'lost'];

export const stageGuideHref = (stage: PlantStage) => `/guides/${GUIDE_FOR_STAGE[stage]}`;
