//! The framing shared by the vector files the host writes for the firmware
//! (`vectors/kernel-bits.bin` for the bit-identity check,
//! `vectors/fuzz-corpus.bin` for the fuzz-corpus cost bench): a 4-byte
//! magic, the header length as a little-endian u32, a UTF-8 header, the
//! record count as a little-endian u32, then the records.

/// The little-endian u32 at byte `at`, if the bytes are there.
pub fn u32_at(bytes: &[u8], at: usize) -> Option<u32> {
    let b = bytes.get(at..at.checked_add(4)?)?;
    Some(u32::from_le_bytes([b[0], b[1], b[2], b[3]]))
}

/// A vector file's framing, opened.
pub struct VectorFile<'a> {
    /// The UTF-8 header.
    pub header: &'a str,
    /// The number of records.
    pub count: u32,
    /// The byte where the first record starts.
    pub records_start: usize,
}

/// Why a vector file could not be opened.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum VectorFileError {
    /// The file does not start with the expected magic.
    NoMagic,
    /// The header length, header or record count is missing or not UTF-8.
    BadHeader,
}

/// Opens `bytes` as a vector file with `magic`.
///
/// # Errors
/// [`VectorFileError::NoMagic`] for another or no magic,
/// [`VectorFileError::BadHeader`] for a truncated or non-UTF-8 header or a
/// missing record count.
pub fn open<'a>(bytes: &'a [u8], magic: &[u8; 4]) -> Result<VectorFile<'a>, VectorFileError> {
    if bytes.get(..4) != Some(magic.as_slice()) {
        return Err(VectorFileError::NoMagic);
    }
    let header_len = u32_at(bytes, 4).ok_or(VectorFileError::BadHeader)?;
    let header_end = 8usize
        .checked_add(header_len as usize)
        .ok_or(VectorFileError::BadHeader)?;
    let header = bytes
        .get(8..header_end)
        .and_then(|h| core::str::from_utf8(h).ok())
        .ok_or(VectorFileError::BadHeader)?;
    let count = u32_at(bytes, header_end).ok_or(VectorFileError::BadHeader)?;
    Ok(VectorFile {
        header,
        count,
        records_start: header_end + 4,
    })
}
