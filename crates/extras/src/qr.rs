//! The QR code of a share link, as SVG markup. The wasm function only converts; the logic is in
//! [`qr_svg_text`], tested natively.

use qrcode::render::svg;
use qrcode::QrCode;
use wasm_bindgen::prelude::*;

/// A QR code of `text` as SVG markup (black modules on white, 4-module quiet zone).
///
/// # Errors
/// Text too long for a QR code.
#[wasm_bindgen]
pub fn qr_svg(text: &str) -> Result<String, JsError> {
    qr_svg_text(text).map_err(|e| JsError::new(&e))
}

/// See [`qr_svg`]: the SVG markup, without the XML declaration, with a role and a label.
///
/// # Errors
/// Text too long for any QR code version.
pub fn qr_svg_text(text: &str) -> Result<String, String> {
    let code = QrCode::new(text.as_bytes())
        .map_err(|e| format!("the link is too long for a QR code: {e}"))?;
    let image = code
        .render::<svg::Color>()
        .min_dimensions(240, 240)
        .dark_color(svg::Color("#000"))
        .light_color(svg::Color("#fff"))
        .build();
    let body = image
        .split_once("?>")
        .map_or(image.as_str(), |(_, rest)| rest);
    Ok(body.replacen(
        "<svg ",
        "<svg role=\"img\" aria-label=\"QR code of this link\" class=\"qr\" ",
        1,
    ))
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn the_qr_code_has_the_size_the_standard_gives_for_its_length() {
        // Source: ISO/IEC 18004, capacity table [memory]: byte mode at error correction level M
        // holds 84 bytes in version 5 and 106 in version 6, so 100 bytes need version 6,
        // 17 + 4·6 = 41 modules a side, plus a 4-module quiet zone on each side = 49.
        let text = "x".repeat(100);
        let svg = qr_svg_text(&text).unwrap();
        assert!(svg.starts_with("<svg role=\"img\""), "{}", &svg[..60]);
        let vb = svg.split("viewBox=\"0 0 ").nth(1).unwrap();
        let w: u32 = vb.split(' ').next().unwrap().parse().unwrap();
        assert_eq!(w % 49, 0, "viewBox width {w}");
        assert!(!svg.contains("style") && !svg.contains("<script"));
        assert!(qr_svg_text(&"x".repeat(4000)).is_err());
    }
}
