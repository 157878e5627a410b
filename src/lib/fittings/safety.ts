/**
 * The meeting-safety caution for fittings, shown on the fittings page and in every booking mail. Shared by the
 * page and the server, so both say the same thing.
 */
export const meetingSafetyTitle = 'Meeting for a fitting';

export const meetingSafetyPoints = [
	'Meet at the workroom or in a public place you both know; Tackline does not arrange fittings in private homes.',
	'Bring someone along if you like — a friend or family member is always welcome at a fitting.',
	'Anyone under 18 is fitted with a parent or guardian present, the whole time.',
	'Follow the local rules where you meet, and leave if anything feels wrong; tell us through the order’s messages.'
] as const;

export function meetingSafetyText() {
	return `${meetingSafetyTitle}:\n${meetingSafetyPoints.map((point) => `- ${point}`).join('\n')}`;
}
