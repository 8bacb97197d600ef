//! Last-good-value holding: when a transmitter faults, the scan goes on with
//! the last good value for a short while and raises a flag, instead of
//! computing with garbage; past a limit the value is dropped (stale).
use crate::loop_scaling::LoopFault;

/// Scans a value may be held before it is treated as lost. At the
/// scenario's 100 ms scan this is half a second (our choice for the demo).
pub const MAX_HELD_SCANS: u16 = 5;

/// What the scan may use for one channel.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum Reading {
    /// A value measured this scan.
    Fresh(f32),
    /// The last good value, held; the channel faulted this scan.
    Held {
        /// Last good value.
        value: f32,
        /// Consecutive scans it has been held (1 = this scan).
        scans: u16,
        /// Why this scan's reading was rejected.
        fault: LoopFault,
    },
    /// No usable value: never measured, or held longer than
    /// [`MAX_HELD_SCANS`].
    Lost(LoopFault),
}

impl Reading {
    /// The value to compute with, if any.
    pub fn value(&self) -> Option<f32> {
        match *self {
            Reading::Fresh(v) | Reading::Held { value: v, .. } => Some(v),
            Reading::Lost(_) => None,
        }
    }
}

/// Per-channel holding state.
#[derive(Debug, Clone, Copy, Default)]
pub struct LastGood {
    value: Option<f32>,
    held_scans: u16,
}

impl LastGood {
    /// Takes this scan's result and says what the scan may use.
    pub fn update(&mut self, reading: Result<f32, LoopFault>) -> Reading {
        match reading {
            Ok(v) => {
                self.value = Some(v);
                self.held_scans = 0;
                Reading::Fresh(v)
            }
            Err(fault) => {
                self.held_scans = self.held_scans.saturating_add(1);
                match self.value {
                    Some(value) if self.held_scans <= MAX_HELD_SCANS => Reading::Held {
                        value,
                        scans: self.held_scans,
                        fault,
                    },
                    _ => Reading::Lost(fault),
                }
            }
        }
    }
}
