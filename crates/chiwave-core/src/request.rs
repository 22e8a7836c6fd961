//! The requests that the page and the CLI both send, one type per observable, and scenarios.
//!
//! Each request type lives beside its physics (for example [`crate::deflection::LightRequest`]);
//! this module gathers them into one tagged [`Request`] so that a scenario file or a page
//! message can carry any of them: `{"kind": "light", ...fields}`.

use crate::deflection::{LightRequest, LightResult};
use crate::encounter::{EncounterRequest, EncounterResult};
use crate::error::InputError;
use crate::lensing::{LensRequest, LensResult};
use serde::{Deserialize, Serialize};

/// Any request, tagged by `kind`.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(tag = "kind", rename_all = "lowercase")]
pub enum Request {
    Light(LightRequest),
    Lens(LensRequest),
    Encounter(EncounterRequest),
}

/// The result of any request (serialised without a tag: the request's kind says what it is).
#[derive(Debug, Clone, PartialEq, Serialize)]
#[serde(untagged)]
pub enum Response {
    Light(Box<LightResult>),
    Lens(Box<LensResult>),
    Encounter(Box<EncounterResult>),
}

/// Evaluates any request.
///
/// # Errors
/// The request's own validation errors (field and allowed range named).
pub fn evaluate(req: &Request) -> Result<Response, InputError> {
    Ok(match req {
        Request::Light(r) => Response::Light(Box::new(r.evaluate()?)),
        Request::Lens(r) => Response::Lens(Box::new(r.evaluate()?)),
        Request::Encounter(r) => Response::Encounter(Box::new(r.evaluate()?)),
    })
}

/// An invented demo scenario (files in `scenarios/`): a name, a sentence, and one request.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct Scenario {
    pub name: String,
    pub description: String,
    pub request: Request,
}
