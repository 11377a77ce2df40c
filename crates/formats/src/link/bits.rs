//! Bit-level writer and reader with the integer codes the link uses.
//!
//! Exp-Golomb code of order k for n ≥ 0: write `n + 2^k` in binary, preceded by as many zero
//! bits as that number has bits after the first `k + 1`; `n < 2^k` costs `k + 1` bits and each
//! doubling of n one bit more per side. Signed numbers go through the zigzag map
//! `0, −1, 1, −2, 2, … → 0, 1, 2, 3, 4, …`.
//! Source: the order-k exponential-Golomb code (ITU-T H.264 §9.1 uses order 0; Wikipedia,
//! "Exponential-Golomb coding", for order k).

use super::LinkError;

/// Most leading zeros an exp-Golomb code may have: values stay below 2^40.
const MAX_ZEROS: u32 = 40;

/// Appends bits, most significant first, into bytes.
#[derive(Debug, Default)]
pub(crate) struct BitWriter {
    bytes: Vec<u8>,
    used: u32,
}

impl BitWriter {
    /// Writes the low `count` bits of `value`, most significant first.
    pub(crate) fn bits(&mut self, value: u64, count: u32) {
        for i in (0..count).rev() {
            self.bit((value >> i) & 1 == 1);
        }
    }

    /// Writes one bit.
    pub(crate) fn bit(&mut self, on: bool) {
        if self.used.is_multiple_of(8) {
            self.bytes.push(0);
        }
        if on {
            if let Some(last) = self.bytes.last_mut() {
                *last |= 0x80 >> (self.used % 8);
            }
        }
        self.used += 1;
    }

    /// Order-k exp-Golomb code of `n`.
    pub(crate) fn golomb(&mut self, n: u64, k: u32) {
        let v = n + (1u64 << k);
        let width = 64 - v.leading_zeros();
        self.bits(0, width - (k + 1));
        self.bits(v, width);
    }

    /// Zigzag then order-k exp-Golomb of a signed number.
    pub(crate) fn signed(&mut self, d: i64, k: u32) {
        self.golomb(zigzag(d), k);
    }

    /// The bytes written; the last one padded with zero bits.
    pub(crate) fn into_bytes(self) -> Vec<u8> {
        self.bytes
    }
}

/// Reads bits written by [`BitWriter`].
#[derive(Debug)]
pub(crate) struct BitReader<'a> {
    bytes: &'a [u8],
    pos: usize,
}

impl<'a> BitReader<'a> {
    pub(crate) fn new(bytes: &'a [u8]) -> Self {
        BitReader { bytes, pos: 0 }
    }

    /// One bit, or `Truncated` past the end.
    pub(crate) fn bit(&mut self) -> Result<bool, LinkError> {
        let byte = self.bytes.get(self.pos / 8).ok_or(LinkError::Truncated)?;
        let on = (byte >> (7 - self.pos % 8)) & 1 == 1;
        self.pos += 1;
        Ok(on)
    }

    /// `count` bits (at most 64) as a number.
    pub(crate) fn bits(&mut self, count: u32) -> Result<u64, LinkError> {
        let mut v = 0u64;
        for _ in 0..count {
            v = (v << 1) | u64::from(self.bit()?);
        }
        Ok(v)
    }

    /// Order-k exp-Golomb code.
    pub(crate) fn golomb(&mut self, k: u32) -> Result<u64, LinkError> {
        let mut zeros = 0;
        while !self.bit()? {
            zeros += 1;
            if zeros > MAX_ZEROS {
                return Err(LinkError::Garbled(
                    "a number is longer than any field allows".into(),
                ));
            }
        }
        let rest = self.bits(zeros + k)?;
        let v = (1u64 << (zeros + k)) | rest;
        Ok(v - (1u64 << k))
    }

    /// Signed number: order-k exp-Golomb, then the inverse zigzag.
    pub(crate) fn signed(&mut self, k: u32) -> Result<i64, LinkError> {
        Ok(unzigzag(self.golomb(k)?))
    }

    /// True when only zero padding (fewer than 8 bits) is left.
    pub(crate) fn only_padding_left(&mut self) -> bool {
        let total = self.bytes.len() * 8;
        if total.saturating_sub(self.pos) >= 8 {
            return false;
        }
        while self.pos < total {
            if let Ok(true) = self.bit() {
                return false;
            }
        }
        true
    }
}

fn zigzag(d: i64) -> u64 {
    ((d << 1) ^ (d >> 63)) as u64
}

fn unzigzag(n: u64) -> i64 {
    ((n >> 1) as i64) ^ -((n & 1) as i64)
}

/// Bits an order-k exp-Golomb code of `n` takes: `2·⌊log2(n + 2^k)⌋ − k + 1`.
#[cfg(test)]
pub(crate) fn golomb_len(n: u64, k: u32) -> u32 {
    let v = n + (1u64 << k);
    2 * (63 - v.leading_zeros()) - k + 1
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn golomb_codes_match_the_textbook_table() {
        // Source: order-0 exp-Golomb table (ITU-T H.264 Table 9-2): 0 → 1, 1 → 010, 2 → 011,
        // 3 → 00100, 4 → 00101.
        let expect = [
            "1", "010", "011", "00100", "00101", "00110", "00111", "0001000",
        ];
        for (n, want) in expect.iter().enumerate() {
            let mut w = BitWriter::default();
            w.golomb(n as u64, 0);
            let bytes = w.into_bytes();
            let mut r = BitReader::new(&bytes);
            let got: String = (0..want.len())
                .map(|_| if r.bit().unwrap() { '1' } else { '0' })
                .collect();
            assert_eq!(&got, want, "n = {n}");
            assert_eq!(golomb_len(n as u64, 0) as usize, want.len());
        }
    }

    #[test]
    fn signed_numbers_round_trip_for_every_order() {
        let values = [
            0i64,
            1,
            -1,
            2,
            -2,
            127,
            -128,
            1000,
            -1_000_000,
            1 << 35,
            -(1 << 35),
        ];
        for k in 0..10 {
            let mut w = BitWriter::default();
            for &v in &values {
                w.signed(v, k);
            }
            let bytes = w.into_bytes();
            let mut r = BitReader::new(&bytes);
            for &v in &values {
                assert_eq!(r.signed(k).unwrap(), v, "k = {k}");
            }
            assert!(r.only_padding_left());
        }
    }

    #[test]
    fn reading_past_the_end_is_truncated() {
        let mut r = BitReader::new(&[0b0000_0000]);
        assert_eq!(r.golomb(0), Err(LinkError::Truncated));
    }
}
