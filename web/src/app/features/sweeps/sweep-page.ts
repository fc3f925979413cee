import { Component } from '@angular/core';
@Component({ selector: 'app-stub', template: 'stub' })
export class SweepPage {}
