import { garmentName } from '$lib/format';
import type { OnboardingStatus, OwnWorkroom, PublicWorkroom } from '$lib/types/workroom';

/** `onboarding` as the API answers it: the ids of the steps still to do. */
export function onboardingJson(status: OnboardingStatus) {
	return { complete: status.complete, missing: status.missing.map((m) => m.step) };
}

export function publicPath(slug: string) {
	return `/workrooms/${slug}`;
}

/** `PUT /api/v1/workroom`'s answer: the tailor's own workroom, exact place included. */
export function ownWorkroomJson(workroom: OwnWorkroom) {
	const { onboardedAt, ...rest } = workroom;
	return { ...rest, url: publicPath(workroom.slug), onboardedAt: onboardedAt?.toISOString() ?? null };
}

/** `GET /api/v1/tailors/{id}`: what anyone may see — the town, never coordinates. */
export function publicWorkroomJson(workroom: PublicWorkroom) {
	return {
		...workroom,
		url: publicPath(workroom.slug),
		specialties: workroom.specialties.map((s) => ({ ...s, name: garmentName(s.id) })),
		memberSince: workroom.memberSince.toISOString()
	};
}
