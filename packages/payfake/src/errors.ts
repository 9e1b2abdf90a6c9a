/** An error answered in the hosted service's shape: `{ error: { type, code, message, param } }`. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly type: 'invalid_request_error' | 'card_error' | 'idempotency_error' | 'api_error' | 'authentication_error',
    message: string,
    readonly code?: string,
    readonly param?: string,
    readonly extra: Record<string, unknown> = {},
  ) {
    super(message);
  }

  body(): { error: Record<string, unknown> } {
    return {
      error: {
        type: this.type,
        message: this.message,
        ...(this.code === undefined ? {} : { code: this.code }),
        ...(this.param === undefined ? {} : { param: this.param }),
        ...this.extra,
      },
    };
  }
}

export const noSuch = (objectName: string, id: string, param = 'id') =>
  new ApiError(404, 'invalid_request_error', `No such ${objectName}: '${id}'`, 'resource_missing', param);

export const missingParam = (param: string) =>
  new ApiError(400, 'invalid_request_error', `Missing required param: ${param}.`, 'parameter_missing', param);

export const invalidParam = (param: string, message: string) =>
  new ApiError(400, 'invalid_request_error', message, 'parameter_invalid', param);
