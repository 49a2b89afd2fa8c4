// The part of libheif-js (libheif compiled to WebAssembly, LGPL-3.0) that heic.ts uses. The package
// ships typings for the raw Emscripten module only, not for its `wasm-bundle` entry point.
declare module "libheif-js/wasm-bundle" {
  /** An Embind enum value: compare by identity with the module's constants. */
  type EnumValue = { readonly value: number };
  type HeifContext = { readonly __brand: "heif_context" };
  type HeifImageHandle = { readonly __brand: "heif_image_handle" };
  type HeifImage = { readonly __brand: "heif_image" };
  type HeifError = { code: EnumValue; message: string };
  /** Plane data is a view into the WebAssembly memory: copy it before releasing the image. */
  type HeifChannel = { id: EnumValue; width: number; height: number; stride: number; data: Uint8Array };
  type DecodedImage = { image: HeifImage; width: number; height: number; channels: HeifChannel[] };

  const libheif: {
    heif_error_code: { heif_error_Ok: EnumValue };
    heif_colorspace: { heif_colorspace_RGB: EnumValue };
    heif_chroma: { heif_chroma_interleaved_RGBA: EnumValue };
    heif_channel: { heif_channel_interleaved: EnumValue };
    heif_context_alloc(): HeifContext;
    heif_context_free(context: HeifContext): void;
    heif_context_read_from_memory(context: HeifContext, bytes: Uint8Array): HeifError;
    heif_js_context_get_primary_image_handle(context: HeifContext): HeifImageHandle | HeifError;
    heif_image_handle_release(handle: HeifImageHandle): void;
    heif_js_decode_image2(handle: HeifImageHandle, colorspace: EnumValue, chroma: EnumValue): DecodedImage | HeifError;
    heif_image_release(image: HeifImage): void;
  };
  export default libheif;
}
