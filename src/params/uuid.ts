import type { ParamMatcher } from '@sveltejs/kit';
import { isUuid } from '$lib/uuid';

export const match = ((param: string): param is string => isUuid(param)) satisfies ParamMatcher;
