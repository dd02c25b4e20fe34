import { type ArgumentMetadata, BadRequestException, ValidationPipe } from '@nestjs/common';

/** Where @nestjs/swagger keeps a DTO's documented properties (DECORATORS in @nestjs/swagger/dist/constants). */
const PROPERTIES_ARRAY = 'swagger/apiModelPropertiesArray';
const PROPERTY = 'swagger/apiModelProperties';

interface PropertyDoc {
  nullable?: boolean;
  isArray?: boolean;
  type?: unknown;
}

/**
 * The global validation pipe: unknown fields are refused, values transformed, and messages name the
 * field first. Before class-validator runs, a JSON body is checked against its DTO's OpenAPI
 * description, which class-validator's `@IsOptional()` does not do:
 *
 * - `null` is accepted only where the property is documented `nullable: true`; elsewhere it is a
 *   400 "<field> must not be null" (an optional field is left out, not sent as null);
 * - a property documented as a DTO (or a list of DTOs) must hold an object (or objects), not a list.
 */
export class AppValidationPipe extends ValidationPipe {
  constructor() {
    super({
      whitelist: true,
      forbidNonWhitelisted: true,
      transform: true,
      // Messages name the field first ("email must be an e-mail address").
      validationError: { target: false, value: false },
    });
  }

  override async transform(value: unknown, metadata: ArgumentMetadata): Promise<unknown> {
    if (metadata.type === 'body' && isDto(metadata.metatype)) {
      const errors: string[] = [];
      if (!isPlainObject(value)) errors.push('body must be a JSON object');
      else shapeErrors(value, metadata.metatype, '', errors);
      if (errors.length) throw new BadRequestException([...new Set(errors)]);
    }
    return super.transform(value, metadata);
  }
}

function isDto(type: unknown): type is { prototype: object } {
  return (
    typeof type === 'function' &&
    Array.isArray(Reflect.getMetadata(PROPERTIES_ARRAY, (type as { prototype: object }).prototype))
  );
}

function isPlainObject(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

/** The DTO class a documented property holds, if any (`type: X`, `type: [X]` or `type: () => X`). */
function dtoOf(doc: PropertyDoc): { prototype: object } | undefined {
  let type = doc.type;
  if (typeof type === 'function' && !(type as { prototype?: unknown }).prototype)
    type = (type as () => unknown)();
  if (Array.isArray(type)) type = type[0];
  return isDto(type) ? type : undefined;
}

function shapeErrors(
  body: Record<string, unknown>,
  dto: { prototype: object },
  path: string,
  out: string[],
): void {
  for (const [key, value] of Object.entries(body)) {
    const doc = Reflect.getMetadata(PROPERTY, dto.prototype, key) as PropertyDoc | undefined;
    if (!doc) continue; // an unknown field: the validation pipe refuses it by name
    const field = `${path}${key}`;
    if (value === null) {
      if (!doc.nullable) out.push(`${field} must not be null`);
      continue;
    }
    const nested = dtoOf(doc);
    if (!nested) continue;
    if (Array.isArray(value)) {
      value.forEach((item, i) => {
        if (isPlainObject(item)) shapeErrors(item, nested, `${field}.${i}.`, out);
        else out.push(`each value in ${field} must be an object`);
      });
    } else if (isPlainObject(value)) shapeErrors(value, nested, `${field}.`, out);
  }
}
