//! The page's files, embedded in the binary: the page needs no network and no file of the
//! installation. uPlot (MIT licence, its notice beside it in `page/vendor/`) draws the
//! charts: 51 kB, no dependencies, hover, zoom and series toggling built in.

/// An embedded file.
#[derive(Debug, Clone, Copy)]
pub struct Asset {
    pub bytes: &'static [u8],
    pub content_type: &'static str,
}

const HTML: &str = "text/html; charset=utf-8";
const JS: &str = "text/javascript; charset=utf-8";
const CSS: &str = "text/css; charset=utf-8";
const TEXT: &str = "text/plain; charset=utf-8";

/// The file served at `path`.
pub fn find(path: &str) -> Option<Asset> {
    let (bytes, content_type): (&[u8], _) = match path {
        "/" | "/index.html" => (include_bytes!("page/index.html"), HTML),
        "/page.js" => (include_bytes!("page/page.js"), JS),
        "/page.css" => (include_bytes!("page/page.css"), CSS),
        "/vendor/uPlot.iife.min.js" => (include_bytes!("page/vendor/uPlot.iife.min.js"), JS),
        "/vendor/uPlot.min.css" => (include_bytes!("page/vendor/uPlot.min.css"), CSS),
        "/vendor/uPlot.LICENSE" => (include_bytes!("page/vendor/uPlot.LICENSE"), TEXT),
        _ => return None,
    };
    Some(Asset {
        bytes,
        content_type,
    })
}
