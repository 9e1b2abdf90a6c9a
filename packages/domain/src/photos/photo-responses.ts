import { z } from 'zod';
import { photoSchema } from './photo-schemas.ts';

export const photoResponseSchema = z.object({ photo: photoSchema });
