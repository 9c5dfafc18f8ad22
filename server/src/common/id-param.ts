/** A row id in the path: decimal digits only, a positive safe integer ("0x10" is not 16). */
export { idTextSchema as idParamSchema } from '@baytime/shared';
